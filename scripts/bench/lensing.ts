// Finite-source magnification throughput (issue 16 item 4). Prints figures and ratios only; never
// passes or fails on timing. Baseline in the same process: the point-source magnification.
//   (a) uniform disk and linearly limb-darkened disk (a = 0.6), ρ = 0.01, u spread over 0..3ρ and out
//       to 100ρ (through the caustic crossing and into the point-source regime)
//   (b) one bench light curve: 400 points of a u0 = 1e-3, ρ = 0.01 event over ±2 t_E
import { cpus, loadavg } from "node:os";
import { finiteSourceMagnification } from "@/lib/lensing";
import { pointLensMagnification } from "@/lib/physics";

const RHO = 0.01;
const CALLS = 20_000;
const LIMB_DARKENED_CALLS = 1_000;
const CURVE_POINTS = 400;
const REPEATS = 5;

function medianSeconds(run: () => void): number {
  const times: number[] = [];
  for (let r = 0; r < REPEATS; r++) {
    const started = performance.now();
    run();
    times.push((performance.now() - started) / 1000);
  }
  return times.sort((a, b) => a - b)[Math.floor(REPEATS / 2)];
}

/** Offsets: half within 3ρ (the disk over the lens), half log-spaced out to 100ρ. */
function offsets(count: number): Float64Array {
  const u = new Float64Array(count);
  for (let i = 0; i < count; i++) u[i] = i % 2 === 0 ? (3 * RHO * (i + 1)) / count : RHO * 10 ** (2 * (i / count));
  return u;
}

console.log(`lensing bench, load average ${loadavg().map((value) => value.toFixed(1)).join(" ")} on ${cpus().length} CPUs (timings of a shared machine are upper bounds)`);
let checksum = 0;
const timed = (label: string, u: Float64Array, magnification: (u: number) => number) => {
  const run = () => {
    for (let i = 0; i < u.length; i++) checksum += magnification(u[i]);
  };
  run(); // JIT warm-up
  const seconds = medianSeconds(run);
  return { label, perCallUs: (seconds / u.length) * 1e6 };
};

const pointSource = timed("point source", offsets(CALLS), pointLensMagnification);
const uniform = timed("uniform disk", offsets(CALLS), (u) => finiteSourceMagnification(u, RHO));
const limbDarkened = timed("limb-darkened disk (a = 0.6)", offsets(LIMB_DARKENED_CALLS), (u) => finiteSourceMagnification(u, RHO, 0.6));
for (const row of [pointSource, uniform, limbDarkened]) {
  console.log(`(a) ${row.label}: ${row.perCallUs.toFixed(2)} µs per call, ${(1 / row.perCallUs).toFixed(3)} million/s; ${(row.perCallUs / pointSource.perCallUs).toFixed(0)}x the point source (median of ${REPEATS})`);
}

const curveU = new Float64Array(CURVE_POINTS);
for (let i = 0; i < CURVE_POINTS; i++) curveU[i] = Math.hypot(1e-3, -2 + (4 * i) / (CURVE_POINTS - 1));
const curveUniform = timed("", curveU, (u) => finiteSourceMagnification(u, RHO));
const curveLimbDarkened = timed("", curveU, (u) => finiteSourceMagnification(u, RHO, 0.6));
console.log(`(b) a ${CURVE_POINTS}-point light curve (u0 = 1e-3, ρ = ${RHO}, ±2 t_E): ${((curveUniform.perCallUs * CURVE_POINTS) / 1000).toFixed(2)} ms uniform, ${((curveLimbDarkened.perCallUs * CURVE_POINTS) / 1000).toFixed(2)} ms limb-darkened [checksum ${checksum.toExponential(3)}]`);
