/**
 * Latin hypercube sample of `count` points in the unit cube of `dimensions` dimensions
 * (McKay, Beckman & Conover 1979, Technometrics 21:239): each dimension is cut into `count`
 * equal strata and every stratum holds exactly one point, at a random place inside it; the
 * strata are paired across dimensions by independent random permutations.
 *
 * @example latinHypercube(50, 5, seededRandom(1)) // 50 points, each [u1 … u5] with 0 ≤ u < 1
 */
export function latinHypercube(count: number, dimensions: number, random: () => number): number[][] {
  if (!Number.isInteger(count) || count < 1) throw new RangeError(`latinHypercube: count must be a positive integer (got ${count})`);
  if (!Number.isInteger(dimensions) || dimensions < 1) throw new RangeError(`latinHypercube: dimensions must be a positive integer (got ${dimensions})`);
  const points = Array.from({ length: count }, () => new Array<number>(dimensions));
  for (let j = 0; j < dimensions; j++) {
    const strata = shuffled(count, random);
    for (let i = 0; i < count; i++) points[i][j] = (strata[i] + random()) / count;
  }
  return points;
}

/** 0 … n−1 in random order (Fisher–Yates shuffle). */
function shuffled(n: number, random: () => number): number[] {
  const order = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const k = Math.floor(random() * (i + 1));
    [order[i], order[k]] = [order[k], order[i]];
  }
  return order;
}
