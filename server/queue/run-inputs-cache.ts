import type { Knex } from 'knex';
import { loadRunInputs, type RunInputs } from '../services/runs/run-inputs';

/**
 * A worker keeps the inputs of the last few runs it simulated: a run's members follow one another
 * in the queue, and reading and unpacking a season of forcing once per member would cost more
 * than some simulations.
 */
export class RunInputsCache {
  private readonly entries = new Map<number, Promise<RunInputs | null>>();

  constructor(private readonly db: Knex, private readonly size = 8) {}

  get(runId: number, organisationId: number): Promise<RunInputs | null> {
    let entry = this.entries.get(runId);
    if (entry) {
      // Most recently used last.
      this.entries.delete(runId);
    } else {
      entry = loadRunInputs(this.db, runId, organisationId);
      // A failed read is not kept.
      entry.catch(() => this.entries.delete(runId));
    }
    this.entries.set(runId, entry);
    while (this.entries.size > this.size) this.entries.delete(this.entries.keys().next().value!);
    return entry;
  }
}
