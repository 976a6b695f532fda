import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allows } from '../../shared/access/capabilities';
import { ROLES, type Role } from '../../shared/schemas/auth';
import { routeTable } from '../../server/routes';
import { signedInAgent } from '../support/factories';
import { createTenantWorld, pathIn, type TenantWorld } from '../support/tenant-world';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let world: TenantWorld;

beforeAll(async () => {
  t = createTestApp();
  world = await createTenantWorld(t.db, t.config.geodata.dir);
  // Other tenants' rows, so a list that scans every organisation has something to scan.
  for (let i = 0; i < 3; i++) await createTenantWorld(t.db, t.config.geodata.dir);
});
afterAll(() => t.close());

interface Query {
  sql: string;
  bindings: readonly unknown[];
}

/** The columns of a row of MariaDB's EXPLAIN this test reads. */
interface PlanRow {
  table: string | null;
  type: string | null;
  key: string | null;
  Extra: string | null;
}

/** Every SELECT the app sends while `work` runs, with its bindings. */
async function selectsDuring(db: Knex, work: () => Promise<void>): Promise<Query[]> {
  const seen = new Map<string, Query>();
  const listen = (q: { sql: string; bindings?: readonly unknown[] }) => {
    if (/^\s*select\b/i.test(q.sql) && !seen.has(q.sql)) seen.set(q.sql, { sql: q.sql, bindings: q.bindings ?? [] });
  };
  db.on('query', listen);
  try {
    await work();
  } finally {
    db.off('query', listen);
  }
  return [...seen.values()];
}

/** Tables with an organisation_id column: tenant data, which a query must reach through an index. */
async function tenantTables(db: Knex): Promise<Set<string>> {
  const rows = await db('information_schema.columns').where({ table_schema: db.raw('database()'), column_name: 'organisation_id' }).select('table_name as name');
  return new Set(rows.map((r: { name: string }) => r.name));
}

/**
 * The accesses to tenant tables that MariaDB's plan (EXPLAIN) makes without any index: a scan of
 * every organisation's rows. On a few test rows a scan costs less than an index, so the plan is
 * asked for as on a large table: `max_seeks_for_key` set low makes the optimizer take an index
 * wherever one serves the statement (MariaDB's documented use of it). A table that is empty is
 * passed over (scanning nothing is its best plan).
 */
async function scansOf(db: Knex, queries: Query[]): Promise<string[]> {
  const tenant = await tenantTables(db);
  const filled = new Map<string, boolean>();
  const hasRows = async (table: string) => {
    if (!filled.has(table)) filled.set(table, (await db(table).first(db.raw('1'))) !== undefined);
    return filled.get(table)!;
  };
  const scans: string[] = [];
  for (const q of queries) {
    const [plan] = (await db.raw(`SET STATEMENT max_seeks_for_key = 1 FOR EXPLAIN ${q.sql}`, q.bindings as Knex.RawBinding[])) as [PlanRow[]];
    for (const row of plan) {
      if (row.table && tenant.has(row.table) && row.key === null && (await hasRows(row.table))) scans.push(`${row.table} (${row.type}, ${row.Extra ?? ''}): ${q.sql}`);
    }
  }
  return scans;
}

describe('query plans of every read route, from the route table', () => {
  it('reach tenant tables through an index on every read route, for every role', async () => {
    const readsOf = (role: Role) => routeTable(t.ctx).filter((r) => r.method === 'get' && r.access !== 'public' && allows(role, r.access));
    const queries: Query[] = [];
    for (const role of ROLES) {
      const agent = await signedInAgent(t.app, world.users[role].email);
      queries.push(...(await selectsDuring(t.db, async () => {
        for (const route of readsOf(role)) {
          const res = await agent.get(pathIn(world, route.path));
          // The payment service is not running here: its 503 is an answer, a 500 never is.
          expect(res.status, `${role}: GET ${route.path}`).not.toBe(500);
        }
      })));
    }
    expect(queries.length).toBeGreaterThan(readsOf('admin').length);
    expect((await scansOf(t.db, queries)).join('\n')).toBe('');
  });

  it('would report a list filtered on a column without an index (control)', async () => {
    const scans = await scansOf(t.db, [{ sql: 'select * from `catchments` where `station_name` = ?', bindings: [world.marker] }]);
    expect(scans).toEqual([expect.stringMatching(/^catchments \(ALL/)]);
  });
});
