import { addDays } from '../melt/calendar';
import { pairDaily, type DatedValue } from '../lab/paired-series';
import { skillScores } from '../lab/skill-scores';
import type { RunSetUp } from '../schemas/results';

/** Fewest paired days a baseline is scored on; fewer say nothing about a season (common practice [memory]). */
export const MIN_SCORED_DAYS = 30;

/**
 * The baseline's skill: its daily outlet discharge (m³ s⁻¹; day d is startDate + d; `routed` when it went through the catchment's stores) against the
 * observed daily discharge on the days both exist — the Kling–Gupta efficiency with its parts
 * (Gupta et al. 2009), the Nash–Sutcliffe efficiency and the percent bias. Null with fewer than
 * MIN_SCORED_DAYS paired days or an observed series that does not vary.
 */
export function baselineSkill(observed: readonly DatedValue[], startDate: string, simulatedM3s: readonly number[], source: string, routed = false): RunSetUp['skill'] {
  const last = addDays(startDate, simulatedM3s.length - 1);
  const pairs = pairDaily(observed, startDate, simulatedM3s, { from: startDate, to: last });
  if (pairs.dates.length < MIN_SCORED_DAYS) return null;
  try {
    const s = skillScores(pairs.observed, pairs.simulated);
    return {
      kge: s.kge, r: s.r, alpha: s.alpha, beta: s.beta, nse: s.nse, biasPercent: s.biasPercent,
      days: s.count, from: pairs.dates[0], to: pairs.dates.at(-1)!, source, routed,
    };
  } catch (error) {
    if (error instanceof RangeError) return null;
    throw error;
  }
}
