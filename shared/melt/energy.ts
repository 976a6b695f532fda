import { LATENT_HEAT_FUSION } from './constants';

/**
 * Melt from a steady energy flux: mm w.e. per day from W m⁻².
 * 1 W m⁻² for a day melts 86400/334000 = 0.2587 mm w.e. [computed].
 */
export function meltMmPerDay(fluxWm2: number): number {
  return (Math.max(0, fluxWm2) * 86400) / LATENT_HEAT_FUSION;
}
