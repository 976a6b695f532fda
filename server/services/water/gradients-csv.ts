import { csvLine } from '../../../shared/csv/csv-writing';
import { MONTH_NAMES } from '../../../shared/hydrology/stations';
import { GRADIENT_ORIGIN_LABELS, type GradientsReply } from '../../../shared/schemas/gradients';
import { roundSignificant } from '../../../shared/text/numbers';
import { profileText } from '../../../shared/text/water-side';

const value = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? null : roundSignificant(v, 6));
const origin = (o: string) => GRADIENT_ORIGIN_LABELS[o as keyof typeof GRADIENT_ORIGIN_LABELS] ?? o;

/**
 * The vertical gradients of a catchment as CSV: a header block with the notes, the twelve months
 * (lapse rate with its fit, the profile in force and how each came about), the precipitation fits,
 * then each station's monthly climatology.
 */
export function gradientsCsv(g: GradientsReply): string {
  const lines = [
    csvLine(['# Tarnish export', 'Vertical gradients from the catchment\'s stations']),
    csvLine(['# Reference elevation (m)', g.referenceElevationM]),
    csvLine(['# Temperature period', g.periods.temperature ? `${g.periods.temperature.from} to ${g.periods.temperature.to}` : 'none']),
    csvLine(['# Precipitation period', g.periods.precipitation ? `${g.periods.precipitation.from} to ${g.periods.precipitation.to}` : 'none']),
    csvLine(['# Used by runs', g.inUse ? 'yes' : 'no (runs use the model parameters\' lapse rate and precipitation gradient)']),
    ...g.notes.map((n) => csvLine(['# Note', n])),
    '',
    csvLine(['month', 'lapse rate in force (°C/km)', 'lapse rate origin', 'fitted lapse rate (°C/km)', 'standard error (°C/km)', 'r²', 'stations', 'precipitation profile in force', 'profile origin']),
    ...MONTH_NAMES.map((name, m) => {
      const fit = g.lapseRates[m];
      return csvLine([name, value(g.chosen.lapseRatesKPerKm[m]), origin(g.chosen.lapseRateOrigin[m]), value(fit.lapseRateKPerKm), value(fit.standardErrorKPerKm), value(fit.r2), fit.n, profileText(g.chosen.profiles[m]), origin(g.chosen.profileOrigin[m])]);
    }),
    '',
    csvLine(['precipitation fit', 'profile', 'reference precipitation (mm)', 'r²', 'stations', 'origin', 'notes']),
    ...g.precipitationFits.map((f) => csvLine([f.label, profileText(f.profile), value(f.referencePrecipitationMm), value(f.r2), f.n, origin(f.status), f.notes.join(' ')])),
    '',
    csvLine(['station', 'network', 'elevation (m)', 'reference station', ...MONTH_NAMES.map((m) => `${m} temperature (°C)`), ...MONTH_NAMES.map((m) => `${m} precipitation (mm)`), 'annual precipitation (mm)']),
    ...g.stations.map((s) => csvLine([
      s.name, s.network, s.elevationM, s.isReference ? 'yes' : 'no',
      ...(s.monthlyTemperatureC ?? Array<null>(12).fill(null)).map(value), ...(s.monthlyPrecipitationMm ?? Array<null>(12).fill(null)).map(value), value(s.annualPrecipitationMm),
    ])),
  ];
  return `${lines.join('\r\n')}\r\n`;
}
