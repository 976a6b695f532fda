import { MAX_NAME_LENGTH, NAME_ATTRIBUTES } from '../../../shared/schemas/outline-batches';

/** Fewest DEM cells an outline must cover: below it its bands rest on a handful of cells (a rule of thumb of ours, as the 25-cell warning per band). */
export const MIN_OUTLINE_CELLS = 100;

/**
 * What is wrong with the names of a file's outlines, by feature number: none, too long, the same
 * as an earlier outline's, or already a catchment's of the organisation (`taken`, lower case:
 * names compare without letter case, as the catchments' unique key does).
 */
export function nameProblems(features: { number: number; name: string | null }[], taken: Set<string>): Map<number, string[]> {
  const problems = new Map<number, string[]>();
  const firstWith = new Map<string, number>();
  for (const { number, name } of features) {
    const own: string[] = [];
    if (name === null) own.push(`It has no name: give every outline a name in one of the attributes ${NAME_ATTRIBUTES.join(', ')}.`);
    else {
      const key = name.toLowerCase();
      if (name.length > MAX_NAME_LENGTH) own.push(`Its name is longer than ${MAX_NAME_LENGTH} characters.`);
      const first = firstWith.get(key);
      if (first !== undefined) own.push(`Outline ${first} has the same name: each catchment needs a name of its own.`);
      else firstWith.set(key, number);
      if (taken.has(key)) own.push(takenProblem(name));
    }
    problems.set(number, own);
  }
  return problems;
}

export const takenProblem = (name: string) => `Your organisation already has a catchment called "${name}".`;

/** An outline covering too few cells of the DEM for its bands to mean anything, in words, or null. */
export function cellsProblem(cells: number, areaKm2: number): string | null {
  if (cells >= MIN_OUTLINE_CELLS) return null;
  return `It covers only ${cells} cell${cells === 1 ? '' : 's'} of the DEM (${areaKm2.toFixed(2)} km²); at least ${MIN_OUTLINE_CELLS} are needed to derive its bands. Use a finer DEM or leave this outline out.`;
}
