import { settledWithin } from './settled-within';

/**
 * Work this process runs beside its answers (lab jobs, batches of outlines), each under a key with
 * a signal to stop it: followed until it ends, abortable one by one or all at a shutdown deadline.
 * The work handles its own errors (it records them where the user reads them); it must not reject.
 */
export class BackgroundWork<K> {
  private readonly active = new Map<K, { controller: AbortController; done: Promise<void> }>();

  /** Starts `work` under `key`. */
  run(key: K, work: (signal: AbortSignal) => Promise<void>): void {
    const controller = new AbortController();
    const done = work(controller.signal).finally(() => this.active.delete(key));
    this.active.set(key, { controller, done });
  }

  /** Stops the work under `key` and waits (at most `waitMs`) for it to end; false when this process runs none under it. */
  async abort(key: K, reason: Error, waitMs = 2000): Promise<boolean> {
    const entry = this.active.get(key);
    if (!entry) return false;
    entry.controller.abort(reason);
    await settledWithin(entry.done, waitMs);
    return true;
  }

  /** Resolves when no work is running. */
  async idle(): Promise<void> {
    while (this.active.size > 0) await Promise.allSettled([...this.active.values()].map((e) => e.done));
  }

  /** Shutdown within a deadline: waits up to `graceMs`, then aborts what is left with `reason` and waits for it to end. */
  async stop(graceMs: number, reason: Error): Promise<void> {
    if (await settledWithin(this.idle(), graceMs)) return;
    for (const { controller } of this.active.values()) controller.abort(reason);
    await this.idle();
  }
}
