import { csvLine } from '../../../shared/csv/csv-writing';
import { BALANCE_UNKNOWN_LABELS, type SavedClosure } from '../../../shared/schemas/water-balance';
import { roundSignificant } from '../../../shared/text/numbers';
import { BALANCE_TERM_LABELS, profileText } from '../../../shared/text/water-side';

const value = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? null : roundSignificant(v, 6));

/**
 * A kept water-balance closure as CSV: how it closed, what was found with its uncertainty, the
 * balance terms with station and inferred precipitation, and station against inferred
 * precipitation per band.
 */
export function closureCsv(catchmentName: string, saved: SavedClosure): string {
  const c = saved.closure;
  const terms = Object.keys(BALANCE_TERM_LABELS) as (keyof typeof BALANCE_TERM_LABELS)[];
  const lines = [
    csvLine(['# Tarnish export', 'Precipitation closed by the water balance']),
    csvLine(['# Catchment', catchmentName]),
    csvLine(['# Period', `${c.period.from} to ${c.period.to}`]),
    csvLine(['# Kept by', `${saved.savedBy} on ${saved.savedAt.slice(0, 10)}${saved.note ? ` (${saved.note})` : ''}`]),
    csvLine(['# Station precipitation', `factor ${value(c.station.precipitationFactor)}, ${profileText(c.station.profile)}`]),
    csvLine(['# Inferred precipitation', `factor ${value(c.candidate.precipitationFactor)}, ${profileText(c.candidate.profile)}`]),
    csvLine(['# Inferred over station precipitation', `${value(c.precipitationRatio.value)} ± ${value(c.precipitationRatio.uncertainty) ?? 'not determined'}`]),
    csvLine(['# Measured runoff', `${value(c.observations.runoff.value)} ± ${value(c.observations.runoff.uncertainty)} mm from ${c.observations.runoff.source}`]),
    ...c.messages.map((m) => csvLine(['# Note', m])),
    '',
    csvLine(['quantity found', 'value', 'standard uncertainty']),
    ...c.unknowns.map((u) => csvLine([
      BALANCE_UNKNOWN_LABELS[u as keyof typeof BALANCE_UNKNOWN_LABELS] ?? u,
      value(u === 'precipitationFactor' ? c.candidate.precipitationFactor : (c.candidate.profile as Record<string, number | string>)[u] as number),
      value(c.uncertainty[u]),
    ])),
    '',
    csvLine(['balance term (mm over the catchment)', 'with station precipitation', 'with inferred precipitation']),
    ...terms.map((t) => csvLine([BALANCE_TERM_LABELS[t], value(c.stationBalance[t]), value(c.balance[t])])),
    '',
    csvLine(['band middle (m)', 'area (km²)', 'station precipitation (mm)', 'inferred precipitation (mm)', 'inferred over station (-)']),
    ...c.bands.map((b) => csvLine([b.midM, b.areaKm2, value(b.stationPrecipitationMm), value(b.inferredPrecipitationMm), value(b.stationPrecipitationMm > 0 ? b.inferredPrecipitationMm / b.stationPrecipitationMm : null)])),
  ];
  return `${lines.join('\r\n')}\r\n`;
}
