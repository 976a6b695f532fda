import { computed, ref, type ComputedRef, type Ref } from 'vue';
import { BAND_FIELDS, bandTableProblems, bandTableSchema, type AspectClassValue, type BandField, type BandProblem, type BandRow } from '@shared/schemas/catchment-bands';

/** A band row as typed in the editor: text per field, so half-typed numbers are kept as written; a response unit keeps its aspect class. */
export type BandDraft = Record<BandField, string> & { aspectClass?: AspectClassValue };
type BandInput = Partial<Record<BandField, number | null>> & { aspectClass?: AspectClassValue };

export interface BandTable {
  rows: Ref<BandDraft[]>;
  problems: Ref<BandProblem[]>;
  /** Problem message per "row:field" (1-based rows), for cell highlighting. */
  cellErrors: ComputedRef<Record<string, string>>;
  load(bands: readonly BandInput[]): void;
  addRow(): void;
  removeRow(index: number): void;
  /** Pastes a block copied from a spreadsheet (tab, semicolon or comma separated) starting at a cell; returns false for a single value. */
  paste(rowIndex: number, fieldIndex: number, text: string): boolean;
  /** The rows as bands if every check passes; otherwise null and `problems` says what and where. */
  validate(): BandRow[] | null;
}

const blankRow = (): BandDraft => Object.fromEntries(BAND_FIELDS.map((f) => [f, ''])) as BandDraft;

/** State and checks of the editable band table; the checks are the server's (shared schema). */
export function useBandTable(): BandTable {
  const rows = ref<BandDraft[]>([]);
  const problems = ref<BandProblem[]>([]);
  const cellErrors = computed(() => Object.fromEntries(problems.value.map((p) => [`${p.row}:${p.column}`, p.message])));

  function load(bands: readonly BandInput[]): void {
    rows.value = bands.map((b) => ({
      ...(Object.fromEntries(BAND_FIELDS.map((f) => [f, b[f] === null || b[f] === undefined ? '' : String(b[f])])) as Record<BandField, string>),
      ...(b.aspectClass ? { aspectClass: b.aspectClass } : {}),
    }));
    problems.value = [];
  }

  function addRow(): void {
    const row = blankRow();
    const last = rows.value[rows.value.length - 1];
    if (last) row.lowerM = last.upperM;
    rows.value.push(row);
  }

  function removeRow(index: number): void {
    rows.value.splice(index, 1);
  }

  function paste(rowIndex: number, fieldIndex: number, text: string): boolean {
    const lines = text.replace(/\r/g, '').split('\n').filter((l) => l.trim() !== '');
    if (lines.length <= 1 && !/[\t;]/.test(text)) return false;
    const cells = lines.map((line) => line.split(/\t|;/).map((c) => c.trim().replace(',', '.')));
    const body = cells[0].some((c) => c !== '' && Number.isNaN(Number(c))) ? cells.slice(1) : cells;
    body.forEach((values, offset) => {
      const target = rowIndex + offset;
      while (rows.value.length <= target) rows.value.push(blankRow());
      values.forEach((value, k) => {
        const field = BAND_FIELDS[fieldIndex + k];
        if (field) rows.value[target][field] = value;
      });
    });
    return true;
  }

  function validate(): BandRow[] | null {
    const found: BandProblem[] = [];
    const bands = rows.value.map((row, i) => ({
      ...Object.fromEntries(BAND_FIELDS.map((field) => {
        const text = row[field].trim();
        const value = text === '' ? Number.NaN : Number(text);
        if (Number.isNaN(value)) found.push({ row: i + 1, column: field, message: text === '' ? 'is empty' : `"${text}" is not a number` });
        return [field, value];
      })),
      ...(row.aspectClass ? { aspectClass: row.aspectClass } : {}),
    }));
    const parsed = bandTableSchema.safeParse(bands);
    if (parsed.success && found.length === 0) {
      problems.value = [];
      return parsed.data;
    }
    // Every problem at once: the cells that are not numbers, each row's checks and the order of the rows.
    problems.value = bandTableProblems(bands, found);
    return null;
  }

  return { rows, problems, cellErrors, load, addRow, removeRow, paste, validate };
}
