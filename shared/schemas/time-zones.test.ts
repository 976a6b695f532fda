import { describe, expect, it } from 'vitest';
import { catchmentFormSchema } from './catchments';
import { aliasesOf, canonicalTimeZone, timeZoneNames } from './time-zones';

describe('time zones', () => {
  it('lists the full IANA set with the canonical names Intl may lack', () => {
    const names = timeZoneNames();
    expect(names[0]).toBe('UTC');
    for (const zone of ['Asia/Kolkata', 'Asia/Kathmandu', 'Europe/Kyiv', 'Europe/Zurich', 'America/Argentina/Buenos_Aires']) expect(names).toContain(zone);
    for (const legacy of ['Asia/Calcutta', 'Asia/Katmandu', 'Etc/UTC']) expect(names).not.toContain(legacy);
    expect(new Set(names).size).toBe(names.length);
    expect(names.length).toBeGreaterThan(400);
    expect(aliasesOf('Asia/Kolkata')).toEqual(['Asia/Calcutta']);
  });

  it('stores aliases and any spelling case as the canonical name and refuses what is not a zone', () => {
    expect(canonicalTimeZone('Asia/Calcutta')).toBe('Asia/Kolkata');
    expect(canonicalTimeZone(' asia/kathmandu ')).toBe('Asia/Kathmandu');
    expect(canonicalTimeZone('Etc/UTC')).toBe('UTC');
    expect(canonicalTimeZone('Europe/Zurich')).toBe('Europe/Zurich');
    for (const bad of ['Asia/Kol', '+05:45', 'Mars/Olympus', '']) expect(canonicalTimeZone(bad)).toBeNull();
    const base = { name: 'Valley', latitudeDeg: 28, longitudeDeg: 84, stationName: 'Station', stationElevationM: 3000 };
    expect(catchmentFormSchema.parse({ ...base, timeZone: 'Asia/Calcutta' }).timeZone).toBe('Asia/Kolkata');
    const refused = catchmentFormSchema.safeParse({ ...base, timeZone: 'Asia/Kol' });
    expect(refused.success).toBe(false);
    expect(refused.error?.issues[0]).toMatchObject({ path: ['timeZone'], message: expect.stringContaining('is not a time zone') });
  });
});
