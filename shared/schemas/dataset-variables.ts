/**
 * The series a catchment can hold, each with the unit it is stored in, the units an upload may use
 * (and how they convert), the time steps it may have and the range outside which a value is
 * physically implausible. Ranges are common practice for screening station data, not limits of nature.
 */
export type TimeStep = 'hourly' | 'daily';

export interface UnitOption {
  unit: string;
  /** Words in a column header that name this unit. */
  headerTokens: readonly string[];
  toStored: (value: number) => number;
}

export interface VariableSpec {
  label: string;
  kind: 'climate' | 'observation';
  storedUnit: string;
  units: readonly UnitOption[];
  steps: readonly TimeStep[];
  min: number;
  max: number;
  /** How a month is summarised: a mean (temperature, discharge) or a total (precipitation). */
  monthly: 'mean' | 'total';
  /** Header words that identify the value column of this variable. */
  headerTokens: readonly string[];
}

const same = (v: number) => v;
const CELSIUS: UnitOption = { unit: '°C', headerTokens: ['°c', 'degc', 'c', 'celsius'], toStored: same };
const KELVIN: UnitOption = { unit: 'K', headerTokens: ['k', 'kelvin'], toStored: (v) => v - 273.15 };
const TEMPERATURE_UNITS = [CELSIUS, KELVIN];
const FRACTION_UNITS: readonly UnitOption[] = [
  { unit: 'fraction', headerTokens: ['fraction', 'frac'], toStored: same },
  { unit: '%', headerTokens: ['%', 'percent', 'pct'], toStored: (v) => v / 100 },
];
const temperature = (label: string, steps: readonly TimeStep[], headerTokens: string[]): VariableSpec => ({
  label, kind: 'climate', storedUnit: '°C', units: TEMPERATURE_UNITS, steps, min: -60, max: 50, monthly: 'mean', headerTokens,
});

export const VARIABLES = {
  temperature: temperature('Air temperature (hourly or daily mean)', ['hourly', 'daily'], ['temperature', 'temp', 't', 'tair', 'tmean', 'ta']),
  temperatureMin: temperature('Daily minimum air temperature', ['daily'], ['tmin', 'min', 'minimum']),
  temperatureMax: temperature('Daily maximum air temperature', ['daily'], ['tmax', 'max', 'maximum']),
  precipitation: {
    label: 'Precipitation', kind: 'climate', storedUnit: 'mm', steps: ['hourly', 'daily'], min: 0, max: 500, monthly: 'total',
    units: [
      { unit: 'mm', headerTokens: ['mm'], toStored: same },
      { unit: 'm', headerTokens: ['m'], toStored: (v) => v * 1000 },
    ],
    headerTokens: ['precipitation', 'precip', 'prcp', 'rain', 'p', 'pr'],
  },
  cloudiness: {
    label: 'Cloudiness', kind: 'climate', storedUnit: 'fraction', units: FRACTION_UNITS, steps: ['hourly', 'daily'],
    min: 0, max: 1, monthly: 'mean', headerTokens: ['cloudiness', 'cloud', 'clouds', 'cc'],
  },
  globalRadiation: {
    label: 'Global radiation', kind: 'climate', storedUnit: 'W/m²', steps: ['hourly', 'daily'], min: 0, max: 1500, monthly: 'mean',
    units: [{ unit: 'W/m²', headerTokens: ['w/m2', 'w/m²', 'wm2', 'wm-2'], toStored: same }],
    headerTokens: ['radiation', 'global', 'rad', 'swin', 'ghi'],
  },
  wind: {
    label: 'Wind speed', kind: 'climate', storedUnit: 'm/s', steps: ['hourly', 'daily'], min: 0, max: 60, monthly: 'mean',
    units: [{ unit: 'm/s', headerTokens: ['m/s', 'ms', 'ms-1'], toStored: same }],
    headerTokens: ['wind', 'windspeed', 'ws', 'u'],
  },
  humidity: {
    label: 'Relative humidity', kind: 'climate', storedUnit: 'fraction', units: FRACTION_UNITS, steps: ['hourly', 'daily'],
    min: 0, max: 1, monthly: 'mean', headerTokens: ['humidity', 'rh', 'relhum'],
  },
  discharge: {
    label: 'Outlet discharge', kind: 'observation', storedUnit: 'm³/s', steps: ['daily'], min: 0, max: 100_000, monthly: 'mean',
    units: [
      { unit: 'm³/s', headerTokens: ['m3/s', 'm³/s', 'cumecs', 'm3s', 'm3s-1'], toStored: same },
      { unit: 'l/s', headerTokens: ['l/s', 'ls'], toStored: (v) => v / 1000 },
    ],
    headerTokens: ['discharge', 'runoff', 'q', 'flow'],
  },
  pointBalance: {
    label: 'Stake mass balance', kind: 'observation', storedUnit: 'm w.e.', steps: ['daily'], min: -20, max: 10, monthly: 'total',
    units: [
      { unit: 'm w.e.', headerTokens: ['m', 'mwe', 'm_we', 'we'], toStored: same },
      { unit: 'mm w.e.', headerTokens: ['mm', 'mmwe'], toStored: (v) => v / 1000 },
    ],
    headerTokens: ['balance', 'mb', 'b'],
  },
} as const satisfies Record<string, VariableSpec>;

/** Variables read as stake readings (stake, elevation, period, balance) rather than as a time series. */
export const STAKE_VARIABLE = 'pointBalance';

export type Variable = keyof typeof VARIABLES;
export const VARIABLE_NAMES = Object.keys(VARIABLES) as Variable[];

export function variableSpec(variable: Variable): VariableSpec {
  return VARIABLES[variable];
}
