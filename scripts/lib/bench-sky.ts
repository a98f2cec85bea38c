// What the sky benchmarks share: one fixed, evenly spread sky and a best-of-n timer.

/** `count` directions spread evenly over the sky (a Fibonacci lattice), ICRS degrees, the same every run. */
export function fibonacciSky(count: number): { raDeg: number; decDeg: number }[] {
  const golden = Math.PI * (3 - Math.sqrt(5));
  return Array.from({ length: count }, (_, i) => {
    const z = 1 - (2 * (i + 0.5)) / count;
    return { raDeg: (((i * golden * 180) / Math.PI) % 360 + 360) % 360, decDeg: (Math.asin(z) * 180) / Math.PI };
  });
}

/** The shortest of `repeats` runs of `run`, seconds. */
export function bestSeconds(run: () => void, repeats: number): number {
  let best = Infinity;
  for (let r = 0; r < repeats; r++) {
    const started = performance.now();
    run();
    best = Math.min(best, (performance.now() - started) / 1000);
  }
  return best;
}
