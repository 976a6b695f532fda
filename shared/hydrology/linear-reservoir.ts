/**
 * A linear reservoir, outflow q = S/k (Hock & Noetzli 1997, Ann. Glaciol. 24:211, after
 * Baker et al. 1982 [memory]), stepped exactly for an inflow that is constant within each step:
 *   dS/dt = I/Δt − S/k  ⇒  S(t+Δt) = S a + I (k/Δt)(1 − a),   a = e^(−Δt/k),
 * so the step's outflow S + I − S(t+Δt) conserves volume to rounding. With no inflow the outflow
 * recedes by the factor a each step.
 */
export interface ReservoirCoefficients {
  /** e^(−Δt/k): share of the storage left after one step without inflow. */
  keep: number;
  /** (k/Δt)(1 − a): share of a step's inflow still stored at its end. */
  storeInflow: number;
}

/**
 * @param storageConstantDays k, days (> 0)
 * @param stepDays Δt, days
 * @example reservoirCoefficients(1, 1) // { keep: 0.3679, storeInflow: 0.6321 }
 */
export function reservoirCoefficients(storageConstantDays: number, stepDays = 1): ReservoirCoefficients {
  if (!(storageConstantDays > 0)) throw new RangeError(`reservoirCoefficients: the storage constant ${storageConstantDays} d must be > 0`);
  const keep = Math.exp(-stepDays / storageConstantDays);
  return { keep, storeInflow: (storageConstantDays / stepDays) * (1 - keep) };
}
