import { seededRandom } from '../../analysis/random';

/**
 * Smooth seeded noise on the plane (value noise with smoothstep blending, summed over octaves
 * that halve in scale): the same seed gives the same terrain everywhere. Returns values of
 * roughly −1…1 for coordinates in metres.
 */
export function valueNoise(seed: number, scaleM: number, octaves: number): (x: number, y: number) => number {
  const random = seededRandom(seed);
  const size = 256;
  const lattice = Float64Array.from({ length: size * size }, () => random() * 2 - 1);
  const at = (i: number, j: number) => lattice[(((j % size) + size) % size) * size + (((i % size) + size) % size)];
  const smooth = (t: number) => t * t * (3 - 2 * t);
  const one = (x: number, y: number) => {
    const i = Math.floor(x);
    const j = Math.floor(y);
    const tx = smooth(x - i);
    const ty = smooth(y - j);
    const top = at(i, j) + tx * (at(i + 1, j) - at(i, j));
    const bottom = at(i, j + 1) + tx * (at(i + 1, j + 1) - at(i, j + 1));
    return top + ty * (bottom - top);
  };
  return (x, y) => {
    let sum = 0;
    let amplitude = 1;
    let norm = 0;
    for (let o = 0; o < octaves; o++) {
      const scale = scaleM / 2 ** o;
      sum += amplitude * one(x / scale + o * 17.3, y / scale - o * 9.1);
      norm += amplitude;
      amplitude *= 0.5;
    }
    return sum / norm;
  };
}
