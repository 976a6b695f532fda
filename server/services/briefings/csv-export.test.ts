import { describe, expect, it } from 'vitest';
import { CAUTIONS } from '../../../shared/text/cautions';
import { briefingCsv } from './csv-export';
import { testSnapshot } from '../../../tests/fixtures/briefing-snapshot';

describe('briefingCsv', () => {
  it('starts with the header block: catchment, scenario, version, input hashes and cautions', () => {
    const csv = briefingCsv(testSnapshot());
    const lines = csv.split('\r\n');
    expect(lines[0]).toBe('Briefing,Added melt in the Hollin valley');
    expect(csv).toContain('Catchment,Hollin valley');
    expect(csv).toContain('Baseline scenario,Baseline');
    expect(csv).toContain('Version,2');
    expect(csv).toMatch(/Input hash: Black carbon 150 ng\/g,[0-9a-f]{64}/);
    for (const caution of CAUTIONS) expect(csv).toContain(caution.includes(',') ? `"${caution}"` : caution);
  });

  it('carries the headline numbers and each table under its heading', () => {
    const s = testSnapshot();
    const csv = briefingCsv(s);
    expect(csv).toContain(`Black carbon 150 ng/g,${s.headlines[0].addedVolumeM3.value}`);
    expect(csv).toContain('\r\nTotals per variant\r\n');
    expect(csv).toContain('\r\nAdded melt by elevation band (table)\r\nElevation band (mean elevation),');
  });

  it('escapes formula-like cells so spreadsheets do not run them', () => {
    const csv = briefingCsv(testSnapshot({ title: '=HYPERLINK("http://evil.example","x")' }));
    const first = csv.split('\r\n')[0];
    expect(first).toBe(`Briefing,"'=HYPERLINK(""http://evil.example"",""x"")"`);
    expect(csv).not.toMatch(/(^|,)=HYPERLINK/m);
  });
});
