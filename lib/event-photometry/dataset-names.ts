/**
 * Dataset names stay unique across a target's photometry files, since the fit gives each dataset its
 * own source and blend flux: a name already taken gets the first free suffix " (2)", " (3)", ….
 * `names` (one file's datasets) are distinct; the result is in their order.
 */
export function uniqueDatasetNames(names: readonly string[], taken: readonly string[]): string[] {
  const used = new Set(taken);
  return names.map((name) => {
    let unique = name;
    for (let n = 2; used.has(unique); n += 1) unique = `${name} (${n})`;
    used.add(unique);
    return unique;
  });
}
