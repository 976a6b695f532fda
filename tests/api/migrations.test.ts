/// <reference types="vite/client" />
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseConfig } from '../../server/config';
import { createDb } from '../../server/db';

/**
 * The migrations on a database of their own (prepared empty by `npm test`): up to the latest,
 * down to nothing with every `down`, and up again to the same schema; and the data repair done
 * by the baseline migration.
 */
const database = process.env.MIGRATIONS_DB_NAME ?? '';
const BASELINE_MIGRATION = '20261201090100_one_baseline_per_catchment.ts';

let db: Knex;
/** The migration files, loaded through the test runner (which reads TypeScript), named as the knex CLI names them. */
const files = import.meta.glob<Knex.Migration>('../../migrations/*.ts');
const migrations: Knex.MigratorConfig = {
  migrationSource: {
    getMigrations: async () => Object.keys(files).sort(),
    getMigrationName: (path: string) => path.split('/').pop()!,
    getMigration: (path: string) => files[path](),
  },
};

beforeAll(() => {
  if (!database.endsWith('_test')) throw new Error('Set MIGRATIONS_DB_NAME to an empty *_test database (npm test does).');
  const config = parseConfig({ ...process.env, NODE_ENV: 'test', DB_NAME: database });
  db = createDb(config.db);
});
afterAll(() => db?.destroy());

async function tables(): Promise<string[]> {
  const [rows] = await db.raw('SELECT TABLE_NAME AS name FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() ORDER BY TABLE_NAME');
  return (rows as { name: string }[]).map((r) => r.name).filter((n) => !n.startsWith('knex_migrations'));
}

/** Every table's definition, without the AUTO_INCREMENT counters that data moves. */
async function schema(): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const table of await tables()) {
    const [rows] = await db.raw('SHOW CREATE TABLE ??', [table]);
    out[table] = String((rows as Record<string, string>[])[0]['Create Table']).replace(/ AUTO_INCREMENT=\d+/, '');
  }
  return out;
}

async function upTo(name: string): Promise<void> {
  const [, pending] = (await db.migrate.list(migrations)) as [unknown[], string[]];
  for (const next of pending) {
    if (next.split('/').pop() === name) return;
    await db.migrate.up(migrations);
  }
  throw new Error(`${name} is not a pending migration`);
}

describe('migrations', () => {
  it('repair scenarios so every catchment has exactly one baseline, then keep it so', async () => {
    await db.migrate.rollback(migrations, true);
    await upTo(BASELINE_MIGRATION);
    const [org] = await db('organisations').insert({ name: 'Repair test' });
    const catchment = async (name: string) => (await db('catchments').insert({
      organisation_id: org, name, description: '', latitude_deg: 34, longitude_deg: 79, time_zone: 'Asia/Kolkata', station_name: 'Probe', station_elevation_m: 3400,
    }))[0];
    const scenario = async (catchmentId: number, name: string, isBaseline: boolean) => (await db('scenarios').insert({
      organisation_id: org, catchment_id: catchmentId, name, description: '', is_baseline: isBaseline, schema_version: 1, changes: '{}',
    }))[0];
    // A variant that took the baseline's name before the baseline was made (the reported bug).
    const blocked = await catchment('Blocked');
    const squatter = await scenario(blocked, 'baseline', false);
    // Two flagged rows, a catchment with none, and one already in order.
    const twice = await catchment('Twice');
    const older = await scenario(twice, 'Baseline', true);
    await scenario(twice, 'Old baseline', true);
    const bare = await catchment('Bare');
    const fine = await catchment('Fine');
    const fineBaseline = await scenario(fine, 'Baseline', true);

    await db.migrate.up(migrations);

    const baselines = async (c: number) => db('scenarios').where({ catchment_id: c, is_baseline: true }).select('id', 'name', 'changes');
    const renamed = await db('scenarios').where({ id: squatter }).first('name', 'is_baseline');
    expect(renamed).toEqual({ name: `Baseline (variant ${squatter})`, is_baseline: 0 });
    expect((await baselines(blocked)).map((b) => b.name)).toEqual(['Baseline']);
    expect((await baselines(twice)).map((b) => b.id)).toEqual([older]);
    const made = await baselines(bare);
    expect(made).toHaveLength(1);
    const changes = typeof made[0].changes === 'string' ? JSON.parse(made[0].changes) : made[0].changes;
    expect(changes).toMatchObject({ schemaVersion: 1, period: null, blackCarbonSnowNgG: 0, parameters: {} });
    expect((await baselines(fine)).map((b) => b.id)).toEqual([fineBaseline]);
    // From now on the database refuses a second baseline for a catchment.
    await expect(scenario(fine, 'Another baseline', true)).rejects.toMatchObject({ code: 'ER_DUP_ENTRY' });
    expect(await scenario(fine, 'A variant', false)).toBeGreaterThan(0);
  });

  it('go down to an empty database with every `down` and up again to the same schema', async () => {
    await db.migrate.rollback(migrations, true);
    await db.migrate.latest(migrations);
    const first = await schema();
    expect(Object.keys(first)).toEqual(expect.arrayContaining(['organisations', 'users', 'catchments', 'scenarios', 'runs', 'briefings', 'lab_jobs']));

    await db.migrate.rollback(migrations, true);
    expect(await tables()).toEqual([]);

    await db.migrate.latest(migrations);
    expect(await schema()).toEqual(first);
    // Every migration three times over, each DDL statement committing on its own: slow on a busy machine.
  }, 120_000);
});
