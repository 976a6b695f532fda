/**
 * `compute` with its answers remembered by key (per thread): at most `max` are kept, and a full
 * memory forgets them all at once, so keys typed at random cannot grow it without end. A call that
 * throws is not remembered. For pure functions whose answer costs far more than a Map lookup
 * (a formatter built for a time zone, a table for a parameter).
 */
export function remembered<A extends unknown[], V>(compute: (...args: A) => V, keyOf: (...args: A) => string | number, max: number): (...args: A) => V {
  const answers = new Map<string | number, V>();
  return (...args: A) => {
    const key = keyOf(...args);
    if (answers.has(key)) return answers.get(key)!;
    const value = compute(...args);
    if (answers.size >= max) answers.clear();
    answers.set(key, value);
    return value;
  };
}
