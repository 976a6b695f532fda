/** What the bundler can tell about a module (the part of Rolldown's module info used here). */
interface ModuleGraph {
  getModuleInfo(id: string): { importedIds: readonly string[] } | null;
}

const closures = new WeakMap<ModuleGraph, Map<string, Set<string>>>();

/**
 * Every module `root` imports statically, directly or through others (dynamic imports not
 * followed), with `root` itself: the code that loads whenever `root` does. Worked out once per
 * chunking pass of the bundler (`graph` is that pass's context).
 */
export function staticImportsOf(graph: ModuleGraph, root: string): Set<string> {
  let byRoot = closures.get(graph);
  if (!byRoot) closures.set(graph, (byRoot = new Map()));
  let seen = byRoot.get(root);
  if (seen) return seen;
  seen = new Set([root]);
  const queue = [root];
  while (queue.length) {
    for (const next of graph.getModuleInfo(queue.pop()!)?.importedIds ?? []) {
      if (seen.has(next)) continue;
      seen.add(next);
      queue.push(next);
    }
  }
  byRoot.set(root, seen);
  return seen;
}
