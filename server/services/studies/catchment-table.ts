import { bandRowSchema, type BandRow } from '../../../shared/schemas/catchment-bands';
import { catchmentTableCatchmentSchema } from '../../../shared/schemas/studies';
import { conflict, validationFailed } from '../../errors';
import { insertBandTable } from '../catchments/band-tables';
import { insertBaseline } from '../catchments/baseline-scenario';
import { insertReferenceStation } from '../stations/reference-station';
import { drivingDatasets } from '../stations/station-rows';
import type { TenantScope } from '../tenant-scope';

const CATCHMENT_COLUMNS = { name: 'name', latitudeDeg: 'latitude_deg', longitudeDeg: 'longitude_deg', timeZone: 'time_zone', stationName: 'station_name', stationElevationM: 'station_elevation_m' } as const;

interface TableCatchment {
  fields: Record<keyof typeof CATCHMENT_COLUMNS, string | number>;
  bands: BandRow[];
}

const number = (v: unknown) => (typeof v === 'string' && v.trim() !== '' && Number.isFinite(Number(v)) ? Number(v) : v);

/**
 * Reads a catchment table (rows as read from the uploaded file, first data row = row 2): rows are
 * grouped by catchment name; every problem is named by row and column, and nothing is stored
 * unless every row is good.
 */
export function readCatchmentTable(rows: Record<string, unknown>[]): TableCatchment[] {
  const problems: { row: number; column: string; message: string }[] = [];
  const byName = new Map<string, TableCatchment>();
  rows.forEach((raw, i) => {
    const row = Object.fromEntries(Object.entries(raw).map(([k, v]) => [k.trim(), k.trim() === 'name' || k.trim() === 'timeZone' || k.trim() === 'stationName' ? v : number(v)]));
    const head = catchmentTableCatchmentSchema.safeParse(row);
    const band = bandRowSchema.safeParse(Object.fromEntries(Object.entries(row).filter(([k]) => !(k in CATCHMENT_COLUMNS))));
    for (const issue of [...(head.success ? [] : head.error.issues), ...(band.success ? [] : band.error.issues)]) {
      problems.push({ row: i + 2, column: String(issue.path[0] ?? ''), message: issue.message });
    }
    if (!head.success || !band.success) return;
    const entry = byName.get(head.data.name) ?? { fields: head.data, bands: [] };
    const differs = (Object.keys(CATCHMENT_COLUMNS) as (keyof typeof CATCHMENT_COLUMNS)[]).find((k) => entry.fields[k] !== head.data[k]);
    if (differs) problems.push({ row: i + 2, column: differs, message: `differs from the first row of "${head.data.name}"` });
    entry.bands.push(band.data);
    byName.set(head.data.name, entry);
  });
  if (problems.length) {
    const first = problems[0];
    throw validationFailed(`Row ${first.row}, column ${first.column}: ${first.message}${problems.length > 1 ? ` (and ${problems.length - 1} more)` : ''}.`, 'rows', { problems: problems.slice(0, 100) });
  }
  return [...byName.values()];
}

/**
 * Makes the table's catchments in one transaction: each with its baseline, its band table, and the
 * reference station, and the reference station's record of `climateFromCatchmentId` copied to it
 * (the region's station), set-based.
 */
export async function createTableCatchments(scope: TenantScope, catchments: TableCatchment[], climateFromCatchmentId: number, userId: number): Promise<{ id: number; name: string }[]> {
  const source = await scope.findOr404<{ background_black_carbon_ng_g: number; background_dust_ug_g: number }>('catchments', climateFromCatchmentId, 'Catchment');
  const clash = await scope.from('catchments').whereIn('name', catchments.map((c) => c.fields.name)).first('name');
  if (clash) throw conflict(`A catchment called "${clash.name as string}" already exists.`, 'rows');
  return scope.transaction(async (s) => {
    const created: { id: number; name: string }[] = [];
    for (const c of catchments) {
      const id = await s.insert('catchments', {
        ...Object.fromEntries(Object.entries(CATCHMENT_COLUMNS).map(([field, column]) => [column, c.fields[field as keyof typeof CATCHMENT_COLUMNS]])),
        description: 'Made from a catchment table.', outlet_description: '',
        background_black_carbon_ng_g: source.background_black_carbon_ng_g, background_dust_ug_g: source.background_dust_ug_g, created_by: userId,
      });
      await insertBaseline(s, id, userId);
      const stationId = await insertReferenceStation(s, id, String(c.fields.stationName), Number(c.fields.stationElevationM));
      await insertBandTable(s, id, c.bands, { userId });
      await copyClimate(s, climateFromCatchmentId, id, stationId);
      created.push({ id, name: String(c.fields.name) });
    }
    return created;
  });
}

/** Copies the series of a catchment's reference station with their values to another catchment's reference station (same organisation). */
async function copyClimate(s: TenantScope, fromId: number, toId: number, toStationId: number): Promise<void> {
  const datasets: { id: number }[] = await drivingDatasets(s, fromId);
  const columns = 'variable, kind, unit, original_unit, time_step, time_zone, source, accuracy, file_name, uploaded_by, uploaded_by_name, first_at, last_at, value_count';
  for (const d of datasets) {
    await s.db.raw(`INSERT INTO datasets (organisation_id, catchment_id, station_id, ${columns}) SELECT organisation_id, ?, ?, ${columns} FROM datasets WHERE id = ? AND organisation_id = ?`,
      [toId, toStationId, d.id, s.organisationId]);
    const [[{ id: newId }]] = (await s.db.raw('SELECT LAST_INSERT_ID() AS id')) as [[{ id: number }]];
    await s.db.raw('INSERT INTO dataset_values (dataset_id, organisation_id, t, value) SELECT ?, organisation_id, t, value FROM dataset_values WHERE dataset_id = ? AND organisation_id = ?',
      [newId, d.id, s.organisationId]);
  }
}
