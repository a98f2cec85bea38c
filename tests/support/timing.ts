/**
 * How many times slower `hostile` runs than `normal`: the ratio of their median times over `runs`
 * rounds of `repeat` calls each, measured alternately so that both see the same machine load. Tests
 * compare this ratio with a bound, never a time with an absolute limit.
 */
export async function slowdown(hostile: () => unknown, normal: () => unknown, { runs = 5, repeat = 1 } = {}): Promise<number> {
  const hostileMs: number[] = [];
  const normalMs: number[] = [];
  const timeOf = async (fn: () => unknown) => {
    const started = performance.now();
    for (let call = 0; call < repeat; call++) await fn();
    return performance.now() - started;
  };
  await timeOf(normal); // warm-up: first calls compile the code under test
  await timeOf(hostile);
  for (let run = 0; run < runs; run++) {
    hostileMs.push(await timeOf(hostile));
    normalMs.push(await timeOf(normal));
  }
  const median = (values: number[]) => values.sort((a, b) => a - b)[Math.floor(values.length / 2)];
  return median(hostileMs) / Math.max(median(normalMs), 1e-3);
}
