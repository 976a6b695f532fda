/**
 * The `geotiff` package loads `web-worker`, which, when imported in any worker thread, takes the
 * thread for a web worker of its own and imports the thread's entry file a second time (without
 * the TypeScript loader, so the thread dies). It stands aside when a worker scope is declared;
 * geotiff's decoder pool, the only user of it, is not used. Import this before anything that
 * loads geotiff in a worker thread.
 */
const scope = globalThis as { WorkerGlobalScope?: unknown };
scope.WorkerGlobalScope ??= function WorkerGlobalScope(): void {};
