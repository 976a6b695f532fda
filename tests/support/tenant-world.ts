import { gzipSync } from 'node:zlib';
import type { Knex } from 'knex';
import { insertBandTable } from '../../server/services/catchments/band-tables';
import { insertBaseline } from '../../server/services/catchments/baseline-scenario';
import { insertReferenceStation } from '../../server/services/stations/reference-station';
import { cellsName, hillshadeName } from '../../server/services/geodata/derivation-service';
import { GeodataStore } from '../../server/services/geodata/geodata-store';
import { encodeGreyAlphaPng } from '../../server/services/geodata/png';
import { TenantScope } from '../../server/services/tenant-scope';
import { testSnapshot } from '../fixtures/briefing-snapshot';
import { createOrganisation, unique, type TestOrg } from './factories';

/** One record of every kind a route's path can name, in one organisation, every name carrying `marker`. */
export interface TenantWorld extends TestOrg {
  marker: string;
  ids: {
    catchment: number; dataset: number; scenario: number; run: number; labJob: number; briefing: number; member: number; invited: number; sharedClient: number;
    geodataUpload: number; derivation: number; station: number; study: number;
  };
  uploadToken: string;
  /** A pending batch of outlines of the world's study, ready to confirm (one outline without its derivation, enough to be read). */
  batchToken: string;
}

/**
 * Rows written straight to the database (and the one map image a derivation's route reads, into
 * `geodataDir`): the matrix needs ids of every kind, each valid enough to be read, not working results.
 */
export async function createTenantWorld(db: Knex, geodataDir: string): Promise<TenantWorld> {
  const marker = unique('World');
  const org = await createOrganisation(db, `${marker} Org`);
  const organisation_id = org.organisationId;
  // An active plan, so paid routes get as far as looking the record up.
  await db('subscriptions').insert({ organisation_id, customer_ref: `cus_${marker}`, subscription_ref: `sub_${marker}`, item_ref: `si_${marker}`, status: 'active', seats: 10 });
  const [catchment] = await db('catchments').insert({
    organisation_id, name: `${marker} basin`, description: marker, latitude_deg: 33, longitude_deg: 75, time_zone: 'Asia/Kolkata',
    station_name: `${marker} camp`, station_elevation_m: 3000, outlet_description: '',
  });
  await insertBaseline(new TenantScope(db, organisation_id), catchment!, null);
  const reference = await insertReferenceStation(new TenantScope(db, organisation_id), catchment!, `${marker} camp`, 3000);
  const [station] = await db('stations').insert({
    organisation_id, catchment_id: catchment, name: `${marker} pass`, network: marker, elevation_m: 3150, accuracy: '[]', is_reference: false,
  });
  const scenario = (await db('scenarios').where({ catchment_id: catchment }).first('id')).id as number;
  await insertBandTable(new TenantScope(db, organisation_id), catchment!, [
    { lowerM: 3000, upperM: 3200, areaKm2: 2, slopeDeg: 10, aspectDeg: 180, glacierFraction: 0.5, debrisFraction: 0, debrisThicknessM: 0 },
  ]);
  const [geodataUpload] = await db('geodata_uploads').insert({
    organisation_id, catchment_id: catchment, kind: 'dem', file_name: `${marker}.tif`, byte_size: 1, stored_name: `${marker}.tif`.replace(/[^\w.-]/g, ''),
    summary: JSON.stringify({ notices: [] }), uploaded_by: org.users.consultant.id,
  });
  const storedPrefix = unique('map').replace(/[^\w-]/g, '');
  // A map of one cell at 3100 m, facing north: its shaded relief and the cell layer the map route reads.
  const store = new GeodataStore(geodataDir);
  await store.write(organisation_id, hillshadeName(storedPrefix), encodeGreyAlphaPng(1, 1, Uint8Array.of(128), Uint8Array.of(255)));
  const cells = Buffer.alloc(3);
  cells.writeInt16LE(3100, 0);
  await store.write(organisation_id, cellsName(storedPrefix), cells);
  const map = {
    crs: { name: 'WGS 84 / UTM zone 43N', proj4: '+proj=utm +zone=43 +datum=WGS84 +units=m +no_defs' },
    extent: [500000, 3650000, 500030, 3650030], width: 1, height: 1, outlines: { catchment: [], glacier: [], debris: [] },
  };
  const summary = {
    areaKm2: 2, trueAreaKm2: 2, glacierAreaKm2: 1, debrisAreaKm2: 0, minElevationM: 3000, maxElevationM: 3200, cellSizeM: 30,
    workingCrs: 'EPSG:32643', centreLonLat: [75, 33], nodataShare: 0,
  };
  const [derivation] = await db('band_derivations').insert({
    organisation_id, catchment_id: catchment, options: JSON.stringify({ bandWidthM: 200, splitByAspect: false, horizonSectors: 0 }),
    upload_ids: JSON.stringify({ dem: geodataUpload }), result: JSON.stringify({ bands: [], units: [], hypsometry: [], summary, notices: [] }),
    map: JSON.stringify(map), stored_prefix: storedPrefix, seconds: 0, created_by: org.users.consultant.id,
  });
  const [dataset] = await db('datasets').insert({
    organisation_id, catchment_id: catchment, station_id: reference, variable: 'temperature', kind: 'climate', unit: '°C', original_unit: '°C', time_step: 'hourly',
    time_zone: 'Asia/Kolkata', source: marker, accuracy: '', file_name: `${marker}.csv`, uploaded_by_name: marker,
    first_at: '2024-01-01 00:00', last_at: '2024-01-01 00:00', value_count: 1,
  });
  await db('dataset_values').insert({ organisation_id, dataset_id: dataset, t: '2024-01-01 00:00', value: -3 });
  const uploadToken = unique('up').replace(/[^A-Za-z0-9]/g, '').padEnd(32, 'x').slice(0, 32);
  await db('pending_uploads').insert({
    organisation_id, catchment_id: catchment, user_id: org.users.consultant.id, token: uploadToken, file_name: `${marker}.csv`,
    fields: JSON.stringify({ variable: 'temperature', timeZone: 'Asia/Kolkata', source: marker, accuracy: '' }),
    read_gz: gzipSync('{}'), expires_at: new Date(Date.now() + 3600_000),
  });
  const [run] = await db('runs').insert({
    organisation_id, catchment_id: catchment, scenario_id: scenario, scenario_name: `${marker} baseline`, is_baseline: true, changes: '{}',
    status: 'failed', engine_version: 'test', input_hash: marker.padEnd(64, '0').slice(0, 64), error_message: marker,
  });
  const [labJob] = await db('lab_jobs').insert({
    organisation_id, catchment_id: catchment, kind: 'sweep', status: 'failed', request: '{}', created_by_name: marker, error_message: marker,
  });
  const [briefing] = await db('briefings').insert({ organisation_id, catchment_id: catchment, title: `${marker} briefing`, summary: marker, selection: JSON.stringify({ runIds: [run] }), latest_version: 1 });
  await db('briefing_versions').insert({ organisation_id, briefing_id: briefing, version: 1, snapshot: JSON.stringify(testSnapshot({ title: `${marker} briefing`, summary: marker })) });
  await db('briefing_shares').insert({ organisation_id, briefing_id: briefing, user_id: org.users.client.id });
  await db('briefing_comments').insert({ organisation_id, briefing_id: briefing, version: 1, user_id: org.users.client.id, body: marker });
  await db('briefing_events').insert({ organisation_id, briefing_id: briefing, version: 1, user_id: org.users.consultant.id, user_email: org.users.consultant.email, action: 'published', detail: marker });
  // A study of the catchment, started, whose one cell is the failed run above.
  const [study] = await db('studies').insert({ organisation_id, name: `${marker} study`, description: marker, options: '{}', started_at: new Date() });
  await db('study_catchments').insert({ organisation_id, study_id: study, catchment_id: catchment });
  const [template] = await db('study_scenarios').insert({ organisation_id, study_id: study, name: `${marker} soot`, changes: '{}' });
  await db('study_scenario_values').insert({ organisation_id, study_scenario_id: template, catchment_id: catchment, changes: '{}' });
  await db('study_runs').insert({ organisation_id, study_id: study, study_scenario_id: template, catchment_id: catchment, run_id: run });
  const batchToken = unique('batch').replace(/[^A-Za-z0-9]/g, '').padEnd(32, 'x').slice(0, 32);
  const file = (fileName: string) => ({ storedName: null, fileName, byteSize: 1, summary: { system: marker, facts: [], notices: [] } });
  const [batch] = await db('pending_outline_batches').insert({
    organisation_id, study_id: study, user_id: org.users.consultant.id, token: batchToken, status: 'ready',
    options: JSON.stringify({ climateFromCatchmentId: catchment, bandWidthM: 200, splitByAspect: false, horizonSectors: 0 }),
    files: JSON.stringify({ dem: file(`${marker}.tif`), catchmentOutline: file(`${marker}.geojson`) }), outline_count: 1, done_count: 1,
    expires_at: new Date(Date.now() + 3600_000),
  });
  await db('pending_outlines').insert({
    organisation_id, batch_id: batch, feature_number: 1, name: `${marker} side valley`,
    summary: JSON.stringify({ problems: [], notices: [], upload: null, derived: null, refused: false }),
  });
  const [invited] = await db('users').insert({ organisation_id, email: `${unique('invited')}@test.example`, name: `${marker} invitee`, role: 'client', status: 'invited' });
  return {
    ...org, marker, uploadToken, batchToken,
    ids: {
      catchment: catchment!, dataset: dataset!, scenario, run: run!, labJob: labJob!, briefing: briefing!, member: org.users.scientist.id, invited: invited!,
      sharedClient: org.users.client.id, geodataUpload: geodataUpload!, derivation: derivation!, station: station!, study: study!,
    },
  };
}

/** The path of a route with every parameter set to this world's record of that kind. */
export function pathIn(world: TenantWorld, path: string): string {
  // A geodata layer is a name, the same in every organisation.
  path = path.replace('/:layer', '/dem');
  const { ids } = world;
  return path.replace(/\/([a-z-]+)\/:([A-Za-z]+)/g, (_all, segment: string, param: string) => {
    const value = (() => {
      if (param === 'catchmentId' || (segment === 'catchments' && param === 'id')) return ids.catchment;
      if (param === 'datasetId') return ids.dataset;
      if (param === 'token') return world.uploadToken;
      if (param === 'batchToken') return world.batchToken;
      if (param === 'jobId') return ids.labJob;
      if (param === 'version') return 1;
      if (param === 'userId') return ids.sharedClient;
      if (param === 'uploadId') return ids.geodataUpload;
      if (param === 'derivationId') return ids.derivation;
      if (param === 'stationId') return ids.station;
      const bySegment: Record<string, number> = { scenarios: ids.scenario, runs: ids.run, briefings: ids.briefing, members: ids.member, invitations: ids.invited, studies: ids.study };
      if (bySegment[segment] !== undefined) return bySegment[segment];
      throw new Error(`no record for :${param} after /${segment} in ${path}`);
    })();
    return `/${segment}/${value}`;
  });
}

/** Every row of the world's organisation in the tables routes can change, to prove a foreign caller changed none. */
export async function snapshotOf(db: Knex, world: TenantWorld): Promise<string> {
  const tables = ['catchments', 'band_tables', 'elevation_bands', 'geodata_uploads', 'band_derivations', 'stations', 'catchment_water_settings', 'water_balance_closures', 'datasets', 'pending_uploads', 'scenarios', 'runs', 'run_years', 'lab_jobs', 'briefings', 'briefing_versions', 'briefing_shares', 'briefing_comments', 'briefing_events', 'studies', 'study_catchments', 'study_scenarios', 'study_scenario_values', 'study_runs', 'pending_outline_batches', 'pending_outlines', 'users'];
  const rows = await Promise.all(tables.map((table) => db(table).where({ organisation_id: world.organisationId }).orderBy('id').select()));
  const values = await db('dataset_values').where({ organisation_id: world.organisationId }).orderBy(['dataset_id', 't']).select();
  return JSON.stringify([...rows, values]);
}
