import { PARAMETER_NAMES, PARAMETER_SPECS, DEFAULT_PARAMETERS } from '../melt/parameters';
import type { ParameterOverrides, ScenarioChanges } from '../schemas/scenarios';

type Monthly = number | number[];
const show = (v: Monthly, unit: string, signed = false) => {
  const one = (x: number) => `${signed && x > 0 ? '+' : ''}${x}`.replace(/^-/, '−');
  return Array.isArray(v) ? `${v.map(one).join(', ')} ${unit} (January to December)` : `${one(v)} ${unit}`;
};
const isZero = (v: Monthly, zero: number) => (Array.isArray(v) ? v.every((x) => x === zero) : v === zero);

/** A scenario's changes in plain words, leaving out what it does not change. */
export function scenarioValues(c: ScenarioChanges): { label: string; value: string }[] {
  const rows: [string, Monthly, number, string, boolean?][] = [
    ['Temperature change', c.temperatureDeltaC, 0, '°C', true],
    ['Precipitation factor', c.precipitationFactor, 1, '×'],
    ['Black carbon in fresh snow, added to the background', c.blackCarbonSnowNgG, 0, 'ng/g'],
    ['Dust in fresh snow, added to the background', c.dustSnowUgG, 0, 'µg/g'],
    ['Black carbon dry deposition', c.blackCarbonDepositionUgM2Day, 0, 'µg/m²/day'],
    ['Dust dry deposition', c.dustDepositionMgM2Day, 0, 'mg/m²/day'],
    ['Black carbon on bare ice (user-set sensitivity)', c.blackCarbonIceNgG, 0, 'ng/g'],
    ['Dust on bare ice (user-set sensitivity)', c.dustIceUgG, 0, 'µg/g'],
    ['Debris thickness change', c.debrisThicknessChangeM, 0, 'm', true],
    ['Debris extent change', c.debrisExtentChange, 0, '(fraction of clean glacier area)'],
  ];
  const out = rows.filter(([, v, zero]) => !isZero(v, zero)).map(([label, v, , unit, signed]) => ({ label, value: show(v, unit, signed) }));
  if (c.precipitationSource !== null) out.push({ label: 'Precipitation from', value: c.precipitationSource === 'water-balance' ? 'the water-balance precipitation (closed against measured runoff)' : 'the station record' });
  if (c.stabilityCorrection !== null) out.push({ label: 'Stability correction of turbulent heat over snow and ice', value: c.stabilityCorrection ? 'on' : 'off' });
  if (c.warmingLevel) out.push({ label: 'Warming level preset', value: `${c.warmingLevel} °C global` });
  if (c.period) out.push({ label: 'Period', value: `${c.period.from} to ${c.period.to}` });
  return out.length ? out : [{ label: 'Changes', value: 'none (present conditions)' }];
}

/** Every model parameter with the value used: the scenario's override or the engine default. */
export function parameterValues(overrides: ParameterOverrides): { label: string; value: string }[] {
  return PARAMETER_NAMES.map((name) => {
    const value = overrides[name] ?? DEFAULT_PARAMETERS[name];
    const unit = PARAMETER_SPECS[name].unit === '-' ? '' : ` ${PARAMETER_SPECS[name].unit}`;
    return { label: PARAMETER_SPECS[name].label, value: `${value}${unit}${overrides[name] === undefined ? '' : ' (set by the scenario)'}` };
  });
}
