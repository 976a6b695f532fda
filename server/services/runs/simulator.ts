import type { MemberInput, MemberSummary } from '../../../shared/analysis/simulate-summary';

/**
 * What the run executor needs to simulate a run's members: the worker pool in the server, the
 * calling thread in the demo seed, a stand-in in tests.
 */
export interface Simulator {
  /** Simulations that can run at once; the executor keeps about twice as many handed over. */
  readonly threads: number;
  /** Simulates one engine input; rejects with an AbortError when `signal` aborts. */
  simulate(input: MemberInput, onProgress: (fraction: number) => void, signal?: AbortSignal): Promise<MemberSummary>;
}
