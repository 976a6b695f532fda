import type { StakeReading } from '../../shared/schemas/stakes';

/**
 * Invented stake readings on the demo glacier for three balance years (1 October to 30 September).
 * Balance b(z) = 0.004·(z − ELA) m w.e. per metre with an invented equilibrium-line altitude that
 * moves between years (5150, 5230, 5090 m); stakes on the debris-covered tongue (below 4600 m)
 * melt 45 % less; plus a deterministic wobble of up to ±0.15 m w.e. Nothing here is measured.
 */
const STAKES = [3900, 4100, 4300, 4500, 4700, 4900, 5100, 5300].map((elevationM, i) => ({ stake: `SV-${i + 1}`, elevationM }));
const YEARS = [{ from: '2021-10-01', to: '2022-09-30', ela: 5150 }, { from: '2022-10-01', to: '2023-09-30', ela: 5230 }, { from: '2023-10-01', to: '2024-09-30', ela: 5090 }];

export function syntheticStakeReadings(): StakeReading[] {
  return YEARS.flatMap((year, y) => STAKES.map(({ stake, elevationM }, s) => {
    const clean = 0.004 * (elevationM - year.ela);
    const debris = elevationM < 4600 && clean < 0 ? 0.55 : 1;
    const wobble = 0.15 * Math.sin(7 * s + 3 * y);
    return { stake, elevationM, from: year.from, to: year.to, balanceMWe: Math.round((clean * debris + wobble) * 100) / 100 };
  }));
}
