import { seededRandom } from '../../shared/analysis/random';
/**
 * Synthetic station record for the demo catchment, generated (never copied) from a documented
 * seasonal cycle plus seeded pseudo-random noise, so every run gives the same numbers.
 *
 * Temperature (hourly, °C, at the 3420 m station):
 *   T = 1.5 − 10.5·cos(2π(doy − 20)/365.25)           annual cycle, coldest around 20 January
 *       + A(doy)·cos(2π(hour − 15)/24)                 daily cycle peaking at 15:00, A = 3.5 °C in winter to 5 °C in summer
 *       + a(day)                                      day-to-day weather: AR(1), φ = 0.7, σ = 2.0 °C
 *       + e(hour)                                     hourly noise, σ = 0.4 °C
 * Precipitation (daily, mm): a wet day with probability
 *   p = 0.18 + 0.27·exp(−((doy − 205)/40)²) + 0.15·exp(−((doy − 60)/35)²)   (summer and late-winter seasons),
 *   wet-day amount exponential with mean 2.5 + 6·(p − 0.18)/0.27 mm.
 * One 5-hour logger gap is left in the temperature. The discharge and stake readings that go with
 * this weather come from the engine itself (demo-observations.ts).
 */
export interface SyntheticStation {
  hourlyTemperature: { times: string[]; values: number[] };
  dailyPrecipitation: { times: string[]; values: number[] };
}

/** Standard normal from two uniforms (Box–Muller). */
export function normal(random: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

const DAY_MS = 86_400_000;

export function syntheticStation(options: { start: string; days: number; seed: number }): SyntheticStation {
  const random = seededRandom(options.seed);
  const startMs = Date.parse(`${options.start}T00:00:00Z`);
  const out: SyntheticStation = {
    hourlyTemperature: { times: [], values: [] },
    dailyPrecipitation: { times: [], values: [] },
  };
  let anomaly = 0;
  for (let d = 0; d < options.days; d++) {
    const dayMs = startMs + d * DAY_MS;
    const date = new Date(dayMs).toISOString().slice(0, 10);
    const doy = Math.floor((dayMs - Date.UTC(new Date(dayMs).getUTCFullYear(), 0, 1)) / DAY_MS) + 1;
    const annual = 1.5 - 10.5 * Math.cos((2 * Math.PI * (doy - 20)) / 365.25);
    const summerness = (1 - Math.cos((2 * Math.PI * (doy - 20)) / 365.25)) / 2;
    const dailyAmplitude = 3.5 + 1.5 * summerness;
    anomaly = 0.7 * anomaly + 2.0 * Math.sqrt(1 - 0.49) * normal(random);
    for (let h = 0; h < 24; h++) {
      const t = annual + dailyAmplitude * Math.cos((2 * Math.PI * (h - 15)) / 24) + anomaly + 0.4 * normal(random);
      if (d === 400 && h >= 9 && h < 14) continue; // logger gap
      out.hourlyTemperature.times.push(`${date} ${String(h).padStart(2, '0')}:00`);
      out.hourlyTemperature.values.push(Math.round(t * 10) / 10);
    }
    const p = 0.18 + 0.27 * Math.exp(-(((doy - 205) / 40) ** 2)) + 0.15 * Math.exp(-(((doy - 60) / 35) ** 2));
    const wet = random() < p;
    const amount = wet ? -Math.log(1 - random()) * (2.5 + (6 * (p - 0.18)) / 0.27) : 0;
    const precipitation = Math.round(amount * 10) / 10;
    out.dailyPrecipitation.times.push(`${date} 00:00`);
    out.dailyPrecipitation.values.push(precipitation);
  }
  return out;
}
