import { describe, expect, it } from 'vitest';
import { csvCell, csvDocument, withByteOrderMark } from './csv-writing';

describe('CSV cells that look like formulas', () => {
  it.each(['=SUM(A1:A2)', '+1+1', '-2+3', '@cmd', '\tx', '\rx'])('prefixes %j with a single quote', (text) => {
    expect(csvCell(text).replace(/^"|"$/g, '').startsWith("'")).toBe(true);
  });

  it('leaves numbers, including negative ones, as numbers', () => {
    expect(csvCell(-3.5)).toBe('-3.5');
    expect(csvCell(null)).toBe('');
    // Every digit kept, never exponent notation.
    expect(csvCell(1.9818207e-8)).toBe('0.000000019818207');
    expect(csvCell(-2e-7)).toBe('-0.0000002');
    expect(csvCell(1.5e21)).toBe('1500000000000000000000');
  });

  it('quotes commas and quotes', () => {
    expect(csvCell('a,"b"')).toBe('"a,""b"""');
    expect(csvDocument(['x'], [['=1']])).toBe("x\r\n'=1\r\n");
  });

  it('escapes formula triggers hidden behind NUL, other control characters, blanks or full-width forms', () => {
    expect(csvCell('\u0000=HYPERLINK("http://x.example")')).toBe(`"'=HYPERLINK(""http://x.example"")"`);
    expect(csvCell('\u0000\u0001+1')).toBe("'+1");
    expect(csvCell('  =1+1')).toBe("'  =1+1");
    expect(csvCell('\u00A0@SUM(A1)')).toBe("'\u00A0@SUM(A1)");
    expect(csvCell('\uFF1D1+1')).toBe("'\uFF1D1+1");
    expect(csvCell('Spring\u0000 melt')).toBe('Spring melt');
    expect(csvCell('Black carbon 400 ng/g')).toBe('Black carbon 400 ng/g');
  });

  it('starts every download with one byte-order mark', () => {
    expect(withByteOrderMark('temperature (°C)\r\n')).toBe('\uFEFFtemperature (°C)\r\n');
    expect(withByteOrderMark(withByteOrderMark('x'))).toBe('\uFEFFx');
  });
});
