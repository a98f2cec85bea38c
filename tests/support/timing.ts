/**
 * How many times slower one call of `hostile` is than one call of `normal`: the ratio of their median
 * times per call over `runs` rounds, measured alternately so that both see the same machine load. A
 * fast call is timed over `normalCalls` (or `hostileCalls`) calls in a row, so the timer's resolution
 * does not decide the ratio. Tests compare this ratio with a bound, never a time with an absolute limit.
 */
export async function slowdown(
  hostile: () => unknown,
  normal: () => unknown,
  { runs = 5, hostileCalls = 1, normalCalls = 1 }: { runs?: number; hostileCalls?: number; normalCalls?: number } = {},
): Promise<number> {
  const perCallMs = async (fn: () => unknown, calls: number) => {
    const started = performance.now();
    for (let call = 0; call < calls; call++) await fn();
    return (performance.now() - started) / calls;
  };
  await perCallMs(normal, 1); // warm-up: first calls compile the code under test
  await perCallMs(hostile, 1);
  const hostileMs: number[] = [];
  const normalMs: number[] = [];
  for (let run = 0; run < runs; run++) {
    hostileMs.push(await perCallMs(hostile, hostileCalls));
    normalMs.push(await perCallMs(normal, normalCalls));
  }
  const median = (values: number[]) => values.sort((a, b) => a - b)[Math.floor(values.length / 2)];
  return median(hostileMs) / Math.max(median(normalMs), 1e-6);
}
