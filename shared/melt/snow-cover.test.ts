import { describe, expect, it } from 'vitest';
import { buildCoverTable, COVER_TABLE_NODES, coverTableFor, readCover } from './snow-cover';

describe('snow cover tables', () => {
  it('are built once per coefficient of variation and read the same as a table built afresh', () => {
    const fresh = buildCoverTable(0.4);
    const shared = coverTableFor(0.4);
    expect(coverTableFor(0.4)).toBe(shared);
    expect(Array.from(shared)).toEqual(Array.from(fresh));
    expect(coverTableFor(0.8)).not.toBe(shared);
  });

  it('rise from no cover without snow to full cover at the peak, never falling on the way', () => {
    const table = coverTableFor(0.6);
    expect(table).toHaveLength(COVER_TABLE_NODES);
    expect(readCover(table, 0)).toBe(0);
    expect(readCover(table, 1)).toBe(1);
    for (let i = 1; i < table.length; i++) expect(table[i]).toBeGreaterThanOrEqual(table[i - 1]);
  });
});
