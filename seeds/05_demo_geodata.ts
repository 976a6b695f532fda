import type { Knex } from 'knex';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { loadConfig } from '../server/config';
import { createContext } from '../server/context';
import type { UserRow } from '../server/services/auth/auth-service';
import { TenantScope } from '../server/services/tenant-scope';
import { geodataUploadFieldsSchema } from '../shared/schemas/geodata';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from './data/demo-accounts';
import { DEMO_CATCHMENT } from './data/demo-catchment';
import { demoGeodataFiles } from './data/demo-geodata';

/**
 * The demo catchment's geodata, generated at seed time (seeds/data/demo-geodata.ts) and stored
 * through the same services as an upload: the DEM, outlines and debris thickness, bands derived
 * from them as a preview beside the hand-made table (36 horizon directions), six snow-cover maps
 * and the 2000–2020 thinning map reduced per band. Safe to re-run: the catchment's geodata is
 * removed and stored again.
 */
export async function seed(knex: Knex): Promise<void> {
  const organisation = await knex('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
  const catchment = organisation && await knex('catchments').where({ organisation_id: organisation.id, name: DEMO_CATCHMENT.name }).first('id');
  if (!catchment) throw new Error('Seed the demo catchment first (02_demo_catchment).');
  const consultant = DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!;
  const user: UserRow = await knex('users').where({ email: consultant.email }).first();
  const ctx = createContext(loadConfig(), knex);
  const scope = new TenantScope(knex, organisation.id);
  const folder = await mkdtemp(path.join(tmpdir(), 'tarnish-demo-geodata-'));
  try {
    const old: { id: number }[] = await scope.from('geodata_uploads').where('catchment_id', catchment.id).select('id');
    for (const { id } of old) await ctx.geodata.uploads.remove(scope, catchment.id, id);
    await scope.from('band_derivations').where('catchment_id', catchment.id).delete();
    const files = demoGeodataFiles();
    const store = async (index: number) => {
      const f = files[index];
      const file = path.join(folder, `${index}-${f.fileName}`);
      await writeFile(file, f.bytes);
      await ctx.geodata.uploads.add(scope, user, catchment.id, f.layer, { file: { path: file, originalname: f.fileName, size: f.bytes.length } }, geodataUploadFieldsSchema.parse(f.fields));
    };
    const observations = files.map((f, i) => ({ f, i })).filter(({ f }) => f.layer === 'snowCover' || f.layer === 'elevationChange');
    for (const { i } of files.map((f, i) => ({ f, i })).filter(({ f }) => !observations.some((o) => o.f === f))) await store(i);
    await ctx.geodata.derivations.derive(scope, user, catchment.id, { bandWidthM: 200, splitByAspect: false, horizonSectors: 36 });
    for (const { i } of observations) await store(i);
  } finally {
    await rm(folder, { recursive: true, force: true });
    await ctx.close();
  }
}
