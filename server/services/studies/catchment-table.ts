import type { z } from 'zod';
import { bandRowSchema, type BandRow } from '../../../shared/schemas/catchment-bands';
import { catchmentTableCatchmentSchema } from '../../../shared/schemas/studies';
import { validationFailed } from '../../errors';
import { insertBandTable } from '../catchments/band-tables';
import type { TenantScope } from '../tenant-scope';
import { assertNamesFree, climateSource, insertRegionCatchment } from './region-catchments';

type CatchmentColumns = z.output<typeof catchmentTableCatchmentSchema>;
/** The columns that describe the catchment (repeated on each of its rows); the others are its band's. */
const CATCHMENT_COLUMNS = Object.keys(catchmentTableCatchmentSchema.shape) as (keyof CatchmentColumns)[];

interface TableCatchment {
  fields: CatchmentColumns;
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
    const band = bandRowSchema.safeParse(Object.fromEntries(Object.entries(row).filter(([k]) => !CATCHMENT_COLUMNS.includes(k as keyof CatchmentColumns))));
    for (const issue of [...(head.success ? [] : head.error.issues), ...(band.success ? [] : band.error.issues)]) {
      problems.push({ row: i + 2, column: String(issue.path[0] ?? ''), message: issue.message });
    }
    if (!head.success || !band.success) return;
    const entry = byName.get(head.data.name) ?? { fields: head.data, bands: [] };
    const differs = CATCHMENT_COLUMNS.find((k) => entry.fields[k] !== head.data[k]);
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
  const source = await climateSource(scope, climateFromCatchmentId);
  await assertNamesFree(scope, catchments.map((c) => c.fields.name), 'rows');
  return scope.transaction(async (s) => {
    const created: { id: number; name: string }[] = [];
    for (const c of catchments) {
      const id = await insertRegionCatchment(s, { ...c.fields, description: 'Made from a catchment table.' }, source, userId);
      await insertBandTable(s, id, c.bands, { userId });
      created.push({ id, name: c.fields.name });
    }
    return created;
  });
}
