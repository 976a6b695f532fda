import { describe, expect, it } from 'vitest';
import { useBandTable } from './useBandTable';

const ROW = ['3000', '3200', '2.5', '18', '170', '0.3', '0.5', '0.2'];

describe('the band table editor', () => {
  it('pastes a tab-separated block copied from a spreadsheet, skipping its header line', () => {
    const table = useBandTable();
    const block = ['lowerM\tupperM\tareaKm2\tslopeDeg\taspectDeg\tglacierFraction\tdebrisFraction\tdebrisThicknessM', ROW.join('\t'), '3200\t3400\t3,1\t20\t180\t0.5\t0.2\t0.1'].join('\r\n');
    expect(table.paste(0, 0, block)).toBe(true);
    expect(table.rows.value).toHaveLength(2);
    expect(table.rows.value[1].areaKm2).toBe('3.1');
    expect(table.validate()).toEqual([
      { lowerM: 3000, upperM: 3200, areaKm2: 2.5, slopeDeg: 18, aspectDeg: 170, glacierFraction: 0.3, debrisFraction: 0.5, debrisThicknessM: 0.2 },
      { lowerM: 3200, upperM: 3400, areaKm2: 3.1, slopeDeg: 20, aspectDeg: 180, glacierFraction: 0.5, debrisFraction: 0.2, debrisThicknessM: 0.1 },
    ]);
  });

  it('pastes a partial block from the cell it lands in and leaves single values to the input', () => {
    const table = useBandTable();
    table.paste(0, 0, ROW.join('\t'));
    expect(table.paste(0, 5, '0.9\t0.1')).toBe(true);
    expect(table.rows.value[0]).toMatchObject({ glacierFraction: '0.9', debrisFraction: '0.1', debrisThicknessM: '0.2' });
    expect(table.paste(0, 0, '2900')).toBe(false);
  });

  it('names row and field of every problem, all at once', () => {
    const table = useBandTable();
    table.paste(0, 0, [ROW.join('\t'), ['3100', '3400', 'x', '20', '180', '0.5', '1.5', '0.1'].join('\t')].join('\n'));
    expect(table.validate()).toBeNull();
    expect(table.problems.value).toEqual([
      { row: 2, column: 'areaKm2', message: '"x" is not a number' },
      { row: 2, column: 'debrisFraction', message: 'must be between 0 and 1' },
      { row: 2, column: 'lowerM', message: expect.stringContaining('overlaps the band below') },
    ]);
    table.rows.value[1].areaKm2 = '3';
    table.rows.value[1].debrisFraction = '0.2';
    expect(table.validate()).toBeNull();
    expect(Object.keys(table.cellErrors.value)).toEqual(['2:lowerM']);
  });

  it('starts a new band where the last one ends', () => {
    const table = useBandTable();
    table.load([{ lowerM: 3000, upperM: 3200 }]);
    table.addRow();
    expect(table.rows.value[1].lowerM).toBe('3200');
    table.removeRow(0);
    expect(table.rows.value).toHaveLength(1);
  });
});
