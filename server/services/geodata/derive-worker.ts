import type { PooledTask } from '../thread-pool';
import { deriveCatchment, type DeriveInput, type DeriveOptions, type DerivedCatchment } from '../../../shared/geodata/derive';

export interface DeriveTask {
  input: DeriveInput;
  options: Omit<DeriveOptions, 'onProgress'>;
  /** Send the per-cell zones back too (tens of MB for a large DEM; copying them stalls the receiving thread). */
  includeZones?: boolean;
}

export type DerivedInWorker = Omit<DerivedCatchment, 'zones'> & { zones?: DerivedCatchment['zones'] };

/**
 * Worker-thread entry for deriving bands (the horizon search takes seconds on a large DEM, so it
 * never runs on the API's event loop): takes a `PooledTask` as the shared thread pool sends it and
 * reports progress fractions on its port.
 */
export default function deriveInWorker({ task, progress }: PooledTask<DeriveTask>): DerivedInWorker {
  let last = 0;
  const { zones, ...derived } = deriveCatchment(task.input, {
    ...task.options,
    onProgress: (fraction) => {
      if (fraction - last >= 0.02 || fraction === 1) {
        last = fraction;
        progress.postMessage(fraction);
      }
    },
  });
  return task.includeZones ? { ...derived, zones } : derived;
}
