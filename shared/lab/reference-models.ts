import { simulate, simulateDegreeDay, simulateEnhancedTemperatureIndex } from '../melt/simulate';
import type { SimulationResult } from '../melt/result';
import { addDays, daysBetween } from '../melt/calendar';
import { catchmentInput, forcingDays } from './calibration-set';
import { selectedBand, type BandSite } from './site';

export const MELT_MODELS = [
  { key: 'energyBalance', label: 'Energy balance', run: simulate },
  { key: 'degreeDay', label: 'Degree-day (Hock 2003 factors)', run: simulateDegreeDay },
  { key: 'enhancedTemperatureIndex', label: 'Enhanced temperature index (Pellicciotti et al. 2005)', run: simulateEnhancedTemperatureIndex },
] as const;
export type MeltModelKey = (typeof MELT_MODELS)[number]['key'];

export interface ModelMelt {
  key: MeltModelKey;
  label: string;
  /** Daily melt of snow and ice over the band, mm w.e., one value per date. */
  dailyMm: number[];
  totalMm: number;
  snowMm: number;
  iceMm: number;
}

export interface ReferenceComparison {
  dates: string[];
  models: ModelMelt[];
}

function bandMelt(result: SimulationResult, firstDay: number): { daily: number[]; snow: number; ice: number } {
  const { snowMeltMm, iceMeltMm, debrisIceMeltMm } = result.bandDay;
  const daily: number[] = [];
  let snow = 0;
  let ice = 0;
  for (let d = firstDay; d < result.dayCount; d++) {
    daily.push(snowMeltMm[d] + iceMeltMm[d] + debrisIceMeltMm[d]);
    snow += snowMeltMm[d];
    ice += iceMeltMm[d] + debrisIceMeltMm[d];
  }
  return { daily, snow, ice };
}

/**
 * Melt of the chosen band by the energy balance and by the two reference models with their
 * published default factors, on the same inputs. Runs from the start of the forcing so the
 * snowpack is built; reports the days of the period.
 */
export function compareMeltModels(site: BandSite): ReferenceComparison {
  const band = selectedBand(site);
  const start = site.forcing.start;
  const last = addDays(start, forcingDays(site.forcing) - 1);
  const to = site.period.to < last ? site.period.to : last;
  // One band on its own: its climate from the gradients, but no snow moved to or from neighbours.
  const water = site.water && { ...site.water, redistribution: null };
  const input = catchmentInput({ ...site, water, catchment: { ...site.catchment, bands: [band] } }, { from: start, to });
  const firstDay = Math.max(0, daysBetween(start, site.period.from));
  const models = MELT_MODELS.map(({ key, label, run }) => {
    const melt = bandMelt(run(input), firstDay);
    return { key, label, dailyMm: melt.daily, totalMm: melt.snow + melt.ice, snowMm: melt.snow, iceMm: melt.ice };
  });
  return { dates: models[0].dailyMm.map((_, i) => addDays(start, firstDay + i)), models };
}
