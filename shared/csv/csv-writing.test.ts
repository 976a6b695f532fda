import { describe, expect, it } from 'vitest';
import { csvCell, csvDocument, withByteOrderMark } from './csv-writing';

describe('CSV cells that look like formulas', () => {
  it.each(['=SUM(A1:A2)', '+1+1', '-2+3', '@cmd', '\tx', '\rx'])('prefixes %j with a single quote', (text) => {
    expect(csvCell(text).replace(/^"|"$/g, '').startsWith("'")).toBe(true);
  });

  it('leaves numbers, including negative ones, as numbers', () => {
    expect(csvCell(-3.5)).toBe('-3.5');
    expect(csvCell(null)).toBe('');
  });

  it('quotes commas and quotes', () => {
    expect(csvCell('a,"b"')).toBe('"a,""b"""');
    expect(csvDocument(['x'], [['=1']])).toBe("x\r\n'=1\r\n");
  });

  it('starts every download with one byte-order mark', () => {
    expect(withByteOrderMark('temperature (°C)\r\n')).toBe('\uFEFFtemperature (°C)\r\n');
    expect(withByteOrderMark(withByteOrderMark('x'))).toBe('\uFEFFx');
  });
});
