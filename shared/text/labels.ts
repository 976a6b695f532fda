import { PARAMETER_SPECS, plainSource, type ParameterName } from '../melt/parameters';
import { VARIABLES, type Variable } from '../schemas/dataset-variables';

/**
 * Words for people: the one table of what users and clients read for every parameter, variable and
 * field — a label, a unit, a one-line help and, where a published source stands behind the value,
 * its citation ("Hock 2003"). The scenario builder, the lab, the band table, the PDF, CSV headers
 * and validation messages read it; internal keys (lowerM, etiThresholdC …) never reach a screen.
 */
export interface FieldLabel {
  label: string;
  /** '' for a dimensionless quantity. */
  unit: string;
  help: string;
  /** The published source, without developers' tags such as "[memory]"; absent for plain inputs. */
  citation?: string;
  /** Allowed range, where the field has one: validation messages say "must be between min and max". */
  min?: number;
  max?: number;
}

/** The band table's columns, in the order of the table and of its CSV file. */
export const BAND_FIELD_LABELS = {
  lowerM: { label: 'Lower elevation', unit: 'm', help: 'Bottom of the band above sea level; equals the upper elevation of the band below.', min: -500, max: 9000 },
  upperM: { label: 'Upper elevation', unit: 'm', help: 'Top of the band above sea level.', min: -500, max: 9000 },
  areaKm2: { label: 'Area', unit: 'km²', help: 'Map area of the band.', min: 0, max: 100_000 },
  slopeDeg: { label: 'Mean slope', unit: '°', help: 'Mean surface slope of the band, 0 flat to 89.', min: 0, max: 89 },
  aspectDeg: { label: 'Mean aspect', unit: '° from north', help: 'Direction the band faces, clockwise from north (180 = south).', min: 0, max: 360 },
  glacierFraction: { label: 'Glacier fraction', unit: '0–1 of band', help: 'Share of the band covered by glacier ice.', min: 0, max: 1 },
  debrisFraction: { label: 'Debris-covered fraction', unit: '0–1 of glacier', help: 'Share of the band\'s glacier under debris.', min: 0, max: 1 },
  debrisThicknessM: { label: 'Debris thickness', unit: 'm', help: 'Mean thickness of the debris where the glacier is covered.', min: 0, max: 10 },
} as const satisfies Record<string, FieldLabel>;

/** A response unit's aspect class, beside the band columns. */
const BAND_UNIT_LABELS: Record<string, FieldLabel> = {
  aspectClass: { label: 'Aspect class', unit: '', help: 'North-, east-, south- or west-facing part of a band split into response units.' },
};

/** Fields of a catchment's form. */
const CATCHMENT_FIELD_LABELS: Record<string, FieldLabel> = {
  name: { label: 'Name', unit: '', help: 'How the catchment is listed.' },
  latitudeDeg: { label: 'Latitude', unit: '°', help: 'North positive.', min: -90, max: 90 },
  longitudeDeg: { label: 'Longitude', unit: '°', help: 'East positive.', min: -180, max: 180 },
  timeZone: { label: 'Time zone', unit: '', help: 'Time zone of the station clock (an IANA name such as Asia/Kathmandu).' },
  stationName: { label: 'Reference station', unit: '', help: 'The station whose record drives the model.' },
  stationElevationM: { label: 'Station elevation', unit: 'm', help: 'Elevation of the reference station.' },
  backgroundBlackCarbonNgG: { label: 'Background black carbon', unit: 'ng/g', help: 'Black carbon in fresh snow today.' },
  backgroundDustUgG: { label: 'Background dust', unit: 'µg/g', help: 'Dust in fresh snow today.' },
};

/** What a scenario changes. */
const SCENARIO_FIELD_LABELS: Record<string, FieldLabel> = {
  temperatureDeltaC: { label: 'Temperature change', unit: '°C', help: 'Added to the station record.' },
  precipitationFactor: { label: 'Precipitation factor', unit: '', help: 'Multiplies the station precipitation; 1 = unchanged.' },
  blackCarbonSnowNgG: { label: 'Black carbon in snow', unit: 'ng/g', help: 'Added to the background in fresh snow.', citation: 'Gul et al. 2022' },
  blackCarbonIceNgG: { label: 'Black carbon on ice', unit: 'ng/g', help: 'A sensitivity you set for bare ice.' },
  dustSnowUgG: { label: 'Dust in snow', unit: 'µg/g', help: 'Added to the background in fresh snow.', citation: 'Gul et al. 2022' },
  dustIceUgG: { label: 'Dust on ice', unit: 'µg/g', help: 'A sensitivity you set for bare ice.' },
  blackCarbonDepositionUgM2Day: { label: 'Black carbon deposition', unit: 'µg/m²/day', help: 'Dry deposition onto the snow between snowfalls.' },
  dustDepositionMgM2Day: { label: 'Dust deposition', unit: 'mg/m²/day', help: 'Dry deposition onto the snow between snowfalls.' },
  debrisThicknessChangeM: { label: 'Debris thickness change', unit: 'm', help: 'Added to every band\'s mean debris thickness.', citation: 'Østrem 1959' },
  debrisExtentChange: { label: 'Debris extent change', unit: '0–1 of clean ice', help: 'Share of clean glacier ice that becomes debris-covered.' },
  period: { label: 'Period', unit: '', help: 'The days reported.' },
};

/** "Jennings et al. 2018" from a parameter's source text; the plain source when it names no author and year. */
export function citationOf(source: string): string {
  const plain = plainSource(source);
  const cited = plain.match(/[A-ZÅØÖÜ][\p{L}'-]+(?: et al\.| (?:&|and) [A-ZÅØÖÜ][\p{L}'-]+)? \d{4}/u);
  if (cited) return cited[0];
  return /common practice/i.test(plain) ? 'common practice' : plain;
}

const parameterLabels = Object.fromEntries(
  (Object.keys(PARAMETER_SPECS) as ParameterName[]).map((name) => {
    const spec = PARAMETER_SPECS[name];
    return [name, { label: spec.label, unit: spec.unit === '-' ? '' : spec.unit, help: plainSource(spec.source), citation: citationOf(spec.source), min: spec.min, max: spec.max }];
  }),
) as Record<ParameterName, FieldLabel>;

const variableLabels = Object.fromEntries(
  (Object.keys(VARIABLES) as Variable[]).map((name) => {
    const spec = VARIABLES[name];
    return [name, { label: spec.label, unit: spec.storedUnit === 'fraction' ? '' : spec.storedUnit, help: `Stored in ${spec.storedUnit}; plausible ${spec.min} to ${spec.max}.`, min: spec.min, max: spec.max }];
  }),
) as Record<Variable, FieldLabel>;

/** Every label, by the key the code uses. */
export const FIELD_LABELS: Readonly<Record<string, FieldLabel>> = {
  ...CATCHMENT_FIELD_LABELS, ...SCENARIO_FIELD_LABELS, ...variableLabels, ...parameterLabels, ...BAND_FIELD_LABELS, ...BAND_UNIT_LABELS,
};

/** Words from a key nobody has labelled yet ("snowDepthM" → "Snow depth m"): never the key itself. */
const wordsOf = (key: string) => {
  const words = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
};

/** The label of a key, or of the last part of a dotted field path ("changes.parameters.iceAlbedo"). */
export function labelOf(key: string): FieldLabel {
  const last = key.split('.').filter((part) => !/^\d+$/.test(part)).pop() ?? key;
  return FIELD_LABELS[last] ?? { label: wordsOf(last), unit: '', help: '' };
}

/** A column header or axis name: "Lower elevation, m"; just the label for dimensionless values. */
export function headerOf(key: string): string {
  const { label, unit } = labelOf(key);
  return unit ? `${label}, ${unit}` : label;
}
