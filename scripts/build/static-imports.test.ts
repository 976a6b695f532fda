import { describe, expect, it } from 'vitest';
import { staticImportsOf } from './static-imports';

/** A graph of modules by their static imports. */
const graphOf = (imports: Record<string, string[]>) => ({
  calls: 0,
  getModuleInfo(id: string) {
    this.calls += 1;
    return id in imports ? { importedIds: imports[id] } : null;
  },
});

describe('staticImportsOf', () => {
  it('follows static imports through any depth and cycles, and only from the root', () => {
    const graph = graphOf({ chart: ['core', 'theme'], core: ['util', 'chart'], theme: ['util'], util: [], page: ['chart', 'table'], table: [] });
    expect([...staticImportsOf(graph, 'chart')].sort()).toEqual(['chart', 'core', 'theme', 'util']);
  });

  it('works the closure out once per graph', () => {
    const graph = graphOf({ a: ['b'], b: [] });
    staticImportsOf(graph, 'a');
    const calls = graph.calls;
    expect(staticImportsOf(graph, 'a').has('b')).toBe(true);
    expect(graph.calls).toBe(calls);
  });
});
