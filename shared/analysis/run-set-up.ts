import { PARAMETER_SPECS, type ParameterName } from '../melt/parameters';
import type { ShortwaveSource } from '../melt/schema';
import type { StartReport } from '../melt/spin-up';
import type { RunSetUp } from '../schemas/results';
import type { ParameterOverrides } from '../schemas/scenarios';
import { formatNumber } from '../text/numbers';

/** How a run's simulations started, in plain words. */
export const START_LABELS: Record<StartReport['method'], string> = {
  'spin-up-record': 'Spun up through the record before the period',
  'spin-up-repeated-year': 'Spun up by simulating the period\'s first year twice',
  'initial-swe': 'Started from the snow water equivalent given per band',
  state: 'Started from the state an earlier run ended with',
};

/** Where a run's incoming shortwave came from, in plain words. */
export const SHORTWAVE_SOURCE_LABELS: Record<ShortwaveSource, string> = {
  measured: 'Measured global radiation',
  cloudiness: 'Clear-sky model with the cloudiness series',
  'temperature-range': 'Clear-sky model with cloud estimated from the daily temperature range (Hargreaves, FAO-56 Eq. 50)',
  'fixed-cloudiness': 'Clear-sky model with a fixed cloudiness (no cloud or radiation data)',
};

/** The calibration a run is checked against: a catchment's newest saved set. */
export interface SavedCalibrationFacts {
  parameters: Partial<Record<ParameterName, number>>;
  precipitationFactor: number;
  period: { from: string; to: string };
  kge: number;
  savedAt: string;
  savedBy: string;
}

export interface CalibrationStatus {
  status: 'calibrated' | 'differs' | 'uncalibrated';
  /** A sentence for every screen and export that shows the run. */
  message: string;
}

const sameValue = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
const day = (iso: string) => iso.slice(0, 10);

/**
 * Whether the parameters a run's baseline was simulated with are the catchment's saved
 * calibration: every calibrated value (and the precipitation factor) must be the one in force.
 * A run built on parameters never calibrated against the catchment's runoff or stakes, or on
 * values that differ from its calibration, gets a warning.
 */
export function calibrationStatus(parameters: ParameterOverrides, precipitationFactor: number | number[], saved: SavedCalibrationFacts | null): CalibrationStatus {
  if (!saved) {
    return {
      status: 'uncalibrated',
      message: 'Not calibrated: no calibration of this catchment against observed runoff or stakes is saved, so the model runs on literature defaults. Treat the added melt as indicative until the baseline is calibrated.',
    };
  }
  const differing: string[] = [];
  for (const [name, value] of Object.entries(saved.parameters) as [ParameterName, number][]) {
    const used = parameters[name] ?? PARAMETER_SPECS[name].default;
    if (!sameValue(used, value)) differing.push(`${PARAMETER_SPECS[name].label.toLowerCase()} ${formatNumber(used, 3)} instead of ${formatNumber(value, 3)}`);
  }
  const factors = Array.isArray(precipitationFactor) ? precipitationFactor : [precipitationFactor];
  if (!factors.every((f) => sameValue(f, saved.precipitationFactor))) {
    differing.push(`precipitation factor ${factors.map((f) => formatNumber(f, 3)).join(', ')} instead of ${formatNumber(saved.precipitationFactor, 3)}`);
  }
  const against = `the calibration saved on ${day(saved.savedAt)} by ${saved.savedBy} (${saved.period.from} to ${saved.period.to}, KGE ${formatNumber(saved.kge, 3)})`;
  if (differing.length) {
    return { status: 'differs', message: `The parameters differ from ${against}: ${differing.join('; ')}. Treat the added melt as indicative, or rerun with the calibrated parameters.` };
  }
  return { status: 'calibrated', message: `Calibrated: the parameters are ${against}.` };
}

/** The baseline's skill in one line, for exports and briefings. */
export function skillText(skill: RunSetUp['skill']): string {
  if (!skill) return 'No observed discharge for the period.';
  const f = (v: number) => formatNumber(v, 2, { fixed: true });
  return `KGE ${f(skill.kge)} (r ${f(skill.r)}, variability ratio ${f(skill.alpha)}, bias ratio ${f(skill.beta)}), NSE ${f(skill.nse)}, `
    + `bias ${formatNumber(skill.biasPercent, 1)} % over ${skill.days} days (${skill.from} to ${skill.to}) against ${skill.source}`
    + `${skill.routed ? ', with the discharge routed to the outlet' : ''}.`;
}

/** The set-up of a run as label–value lines, in the order exports and briefings print them. */
export function setUpLines(setUp: RunSetUp): [string, string][] {
  return [
    ['Calibration', setUp.calibration.message],
    ['Start', setUp.start ? setUp.start.note : 'Not recorded (run made before engine 2.0).'],
    ['Incoming shortwave', setUp.shortwaveSource ?? 'Not recorded.'],
    ['Baseline against observed discharge', skillText(setUp.skill)],
    ...setUp.waterSide.map((l): [string, string] => [l.label, l.value]),
  ];
}
