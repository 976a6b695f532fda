import { LATENT_HEAT_FUSION, SECONDS_PER_HOUR, SPECIFIC_HEAT_ICE } from './constants';

/** mm w.e. melted by 1 J m⁻²: 1 kg m⁻² = 1 mm w.e.; m = E/Lf (common practice). */
export const MM_PER_JOULE = 1 / LATENT_HEAT_FUSION;

/**
 * Melt from a steady energy flux: mm w.e. per day from W m⁻².
 * 1 W m⁻² for a day melts 86400/334000 = 0.2587 mm w.e. [computed].
 */
export function meltMmPerDay(fluxWm2: number): number {
  return (Math.max(0, fluxWm2) * 86400) / LATENT_HEAT_FUSION;
}

/**
 * Sensible-heat coefficient ρa cp CH u, W m⁻² K⁻¹, bulk method with ρa = P/(Rd T).
 */
export function sensibleCoefficient(pressurePa: number, airTempK: number, exchangeCoefficient: number, windMs: number, cpOverRd: number): number {
  return ((pressurePa / airTempK) * cpOverRd) * exchangeCoefficient * windMs;
}

/**
 * One hour of energy for a melting surface with cold content (J m⁻²).
 * A positive surplus first repays the cold content, the rest melts; a negative surplus adds to the
 * cold content, which cannot exceed the heat needed to warm `massKgM2` of ice from the air
 * temperature to 0 °C — the surface cools no further than the air (an assumption of this engine).
 * Writes the new cold content to state[index] and returns the melt-energy in J m⁻².
 */
export function spendSurplus(surplusWm2: number, coldContent: Float64Array, index: number, massKgM2: number, airTempC: number): number {
  const energy = surplusWm2 * SECONDS_PER_HOUR;
  const cc = coldContent[index];
  if (energy >= 0) {
    if (energy <= cc) {
      coldContent[index] = cc - energy;
      return 0;
    }
    coldContent[index] = 0;
    return energy - cc;
  }
  const cap = airTempC < 0 ? SPECIFIC_HEAT_ICE * massKgM2 * -airTempC : 0;
  const grown = cc - energy;
  coldContent[index] = grown < cap ? grown : cap > cc ? cap : cc;
  return 0;
}
