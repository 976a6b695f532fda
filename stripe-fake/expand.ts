import type { FakeStripeState } from './store';

type Json = Record<string, unknown>;

/** Which collection an id belongs to, by its prefix. */
function lookup(state: FakeStripeState, id: string): unknown {
  const prefix = id.slice(0, id.indexOf('_'));
  const byPrefix: Record<string, { get(id: string): unknown }> = {
    cus: state.customers,
    prod: state.products,
    price: state.prices,
    cs: state.sessions,
    sub: state.subscriptions,
    in: state.invoices,
    evt: state.events,
  };
  return byPrefix[prefix]?.get(id);
}

function expandPath(state: FakeStripeState, node: unknown, path: string[]): unknown {
  if (Array.isArray(node)) return node.map((element) => expandPath(state, element, path));
  if (path.length === 0) {
    return typeof node === 'string' ? structuredClone(lookup(state, node) ?? node) : node;
  }
  if (node === null || typeof node !== 'object') return node;
  const [field, ...rest] = path;
  const object = node as Json;
  if (field in object) object[field] = expandPath(state, object[field], rest);
  return node;
}

/**
 * A copy of `object` with the id fields named in `expand` (dotted paths such as
 * `subscription.latest_invoice` or `data.customer`) replaced by the objects they name.
 */
export function present<T>(state: FakeStripeState, object: T, expand: string[] = []): T {
  const copy = structuredClone(object);
  for (const path of expand) expandPath(state, copy, path.split('.'));
  return copy;
}
