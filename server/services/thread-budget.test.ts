import { describe, expect, it } from 'vitest';
import { ThreadBudget } from './thread-budget';

/** A task that runs until `finish()` is called, recording how many tasks ran at its start. */
function gate(budget: ThreadBudget, log: string[], name: string) {
  let finish!: () => void;
  const done = new Promise<void>((resolve) => (finish = resolve));
  return { finish, work: () => { log.push(`${name}@${budget.busy}`); return done; } };
}

const tick = () => new Promise((r) => setImmediate(r));

describe('ThreadBudget', () => {
  it('never runs more tasks at once than it has threads', async () => {
    const budget = new ThreadBudget(2);
    const log: string[] = [];
    const tasks = ['a', 'b', 'c', 'd'].map((n) => gate(budget, log, n));
    const running = tasks.map((t) => budget.use('batch', t.work));
    await tick();
    expect(log).toEqual(['a@2', 'b@2']);
    tasks[0].finish();
    await tick();
    expect(log).toEqual(['a@2', 'b@2', 'c@2']);
    tasks.slice(1).forEach((t) => t.finish());
    await Promise.all(running);
    expect(log).toHaveLength(4);
    expect(budget.busy).toBe(0);
  });

  it('serves interactive tasks before batch tasks that waited longer', async () => {
    const budget = new ThreadBudget(1);
    const log: string[] = [];
    const first = gate(budget, log, 'run-1');
    const queuedRun = gate(budget, log, 'run-2');
    const pdf = gate(budget, log, 'pdf');
    const all = [budget.use('batch', first.work), budget.use('batch', queuedRun.work), budget.use('interactive', pdf.work)];
    await tick();
    first.finish();
    await tick();
    expect(log).toEqual(['run-1@1', 'pdf@1']);
    pdf.finish();
    await tick();
    queuedRun.finish();
    await Promise.all(all);
    expect(log).toEqual(['run-1@1', 'pdf@1', 'run-2@1']);
  });

  it('drops a waiting task whose signal aborts, without taking a thread', async () => {
    const budget = new ThreadBudget(1);
    const log: string[] = [];
    const holder = gate(budget, log, 'holder');
    const held = budget.use('batch', holder.work);
    const controller = new AbortController();
    const waiting = budget.use('batch', async () => log.push('never'), controller.signal);
    controller.abort(new Error('cancelled'));
    await expect(waiting).rejects.toThrow('cancelled');
    holder.finish();
    await held;
    expect(log).toEqual(['holder@1']);
    expect(budget.busy).toBe(0);
  });

  it('releases the thread when a task fails', async () => {
    const budget = new ThreadBudget(1);
    await expect(budget.use('batch', async () => { throw new Error('engine stopped'); })).rejects.toThrow('engine stopped');
    expect(await budget.use('batch', async () => 'next')).toBe('next');
  });

  it('refuses a budget of no threads', () => {
    expect(() => new ThreadBudget(0)).toThrow(RangeError);
  });
});
