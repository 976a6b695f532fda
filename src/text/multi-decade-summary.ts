import type { TransientOptions } from '@shared/schemas/runs';

/** A multi-decade run's options in a few words, as run lists and study headers show them. */
export const multiDecadeSummary = (t: TransientOptions) => `${t.years} years from ${t.fromYear}, ${t.warmingLevelC} °C by ${t.targetYear}`;
