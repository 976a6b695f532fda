import { LATENT_HEAT_FUSION, SECONDS_PER_HOUR, STEFAN_BOLTZMANN, ZERO_CELSIUS_K } from './constants';
import { stabilityFactor } from './turbulence';

/**
 * One hour of a debris layer over ice at 0 °C, per m² of continuous debris, with heat stored in
 * the layer (after Reid & Brock 2010, J. Glaciol. 56:903, who use a finite-difference debris
 * column) [memory]: three nodes at the surface and at 15 % and 50 % of the thickness h, holding
 * the heat of 0–7.5 %, 7.5–32.5 % and 32.5–75 % of the layer, linked by conductances k/(0.15 h),
 * k/(0.35 h) and k/(0.5 h) to the ice (so in steady state the flux is k Ts / h, as in Nicholson &
 * Benn 2006). The surface node balances SW(1 − α) + L↓ − ε σ Ts⁴ + QH (stability-corrected,
 * with the debris's own roughness). One implicit step per hour, the surface flux linearised at
 * the old surface temperature; ice melts from the heat conducted into it (none when the base of
 * the layer is below 0 °C: the ice stays at 0 °C, an assumption). Dry debris: no latent heat.
 */
export const DEBRIS = { surfaceC: 0, upperC: 1, lowerC: 2, melt: 3, netLongwave: 4, sensible: 5, conducted: 6 } as const;

export interface DebrisColumn {
  thicknessM: number;
  conductivity: number;
  /** Volumetric heat capacity, J m⁻³ K⁻¹. */
  heatCapacity: number;
  emissivity: number;
  /** ρa cp CH u of neutral air over the debris, W m⁻² K⁻¹. */
  sensibleCoefficient: number;
  drag: number;
  heightOverRoughness: number;
}

/**
 * Where stepDebrisFrom reads its numbers in its input array: absorbed shortwave and incoming
 * longwave (W m⁻², the longwave already times the debris emissivity), air temperature (°C), wind
 * (m s⁻¹) and the three node temperatures (°C). An array instead of arguments for the reason
 * given at STEP_IN (surface-flux.ts).
 */
export const DEBRIS_IN = { absorbed: 0, longIn: 1, airC: 2, windMs: 3, surfaceC: 4, upperC: 5, lowerC: 6 } as const;
export const DEBRIS_IN_SIZE = 7;

const debrisInput = new Float64Array(DEBRIS_IN_SIZE);

/** The same as stepDebrisFrom with its numbers given as arguments. */
export function stepDebris(
  out: Float64Array, column: DebrisColumn, absorbedWm2: number, longInWm2: number, airC: number, windMs: number,
  surfaceC: number, upperC: number, lowerC: number, stability: boolean,
): void {
  const input = debrisInput;
  input[DEBRIS_IN.absorbed] = absorbedWm2;
  input[DEBRIS_IN.longIn] = longInWm2;
  input[DEBRIS_IN.airC] = airC;
  input[DEBRIS_IN.windMs] = windMs;
  input[DEBRIS_IN.surfaceC] = surfaceC;
  input[DEBRIS_IN.upperC] = upperC;
  input[DEBRIS_IN.lowerC] = lowerC;
  stepDebrisFrom(out, input, column, stability);
}

/** One hour of the debris column, reading its numbers from `input` (DEBRIS_IN.*); writes DEBRIS.* into `out`. */
export function stepDebrisFrom(out: Float64Array, input: Float64Array, column: DebrisColumn, stability: boolean): void {
  const airC = input[DEBRIS_IN.airC];
  const surfaceC = input[DEBRIS_IN.surfaceC];
  const longInWm2 = input[DEBRIS_IN.longIn];
  const dt = SECONDS_PER_HOUR;
  const h = column.thicknessM;
  const cap = column.heatCapacity * h / dt;
  const c0 = 0.075 * cap;
  const c1 = 0.25 * cap;
  const c2 = 0.425 * cap;
  const k01 = column.conductivity / (0.15 * h);
  const k12 = column.conductivity / (0.35 * h);
  const k2i = column.conductivity / (0.5 * h);

  const fh = stability ? stabilityFactor(airC, surfaceC, input[DEBRIS_IN.windMs], column.drag, column.heightOverRoughness) : 1;
  const hc = column.sensibleCoefficient * fh;
  const tk = surfaceC + ZERO_CELSIUS_K;
  const es = column.emissivity * STEFAN_BOLTZMANN;
  const longOut = es * tk * tk * tk * tk;
  const longSlope = 4 * es * tk * tk * tk;
  const f = input[DEBRIS_IN.absorbed] + longInWm2 - longOut + hc * (airC - surfaceC);
  const d = longSlope + hc;

  // Tridiagonal system, solved by elimination (Thomas algorithm).
  const a0 = c0 + d + k01, r0 = c0 * surfaceC + f + d * surfaceC;
  const a1 = c1 + k01 + k12, r1 = c1 * input[DEBRIS_IN.upperC];
  const a2 = c2 + k12 + k2i, r2 = c2 * input[DEBRIS_IN.lowerC];
  const a1p = a1 - (k01 * k01) / a0;
  const r1p = r1 + (k01 * r0) / a0;
  const a2p = a2 - (k12 * k12) / a1p;
  const r2p = r2 + (k12 * r1p) / a1p;
  const t2 = r2p / a2p;
  const t1 = (r1p + k12 * t2) / a1p;
  const t0 = (r0 + k01 * t1) / a0;

  const conducted = k2i * t2;
  const change = t0 - surfaceC;
  out[DEBRIS.surfaceC] = t0;
  out[DEBRIS.upperC] = t1;
  out[DEBRIS.lowerC] = t2;
  out[DEBRIS.melt] = conducted > 0 ? (conducted * dt) / LATENT_HEAT_FUSION : 0;
  out[DEBRIS.netLongwave] = longInWm2 - longOut - longSlope * change;
  out[DEBRIS.sensible] = hc * (airC - surfaceC) - hc * change;
  out[DEBRIS.conducted] = conducted;
}
