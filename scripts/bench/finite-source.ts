// Finite-source magnification far from the lens: the series in the source radius against the exact
// quadrature it replaces there (lib/lensing/finite-source.ts), and what that does to a finite-source
// light-curve fit (issue 19). Prints figures and ratios only; never passes or fails on timing.
//   (a) per call on a light-curve-like grid (u from 0.05 to 3, ρ = 0.01) for a = 0.5 and a = 0:
//       the quadrature alone (finiteSourceMagnificationExact, the function's path before the series
//       for the uniform disk; its former point-source shortcut never fired on this grid) against
//       finiteSourceMagnification, in the same process, with the largest relative difference;
//   (b) a limb-darkened (a = 0.5) finite-source fit of the demo event's photometry
//       (public/demo/cinder-avocet-photometry.csv, 310 points), read as the upload reads it;
//   (c) the prediction from that fit with the page's options (fit-choices.ts: 1,000 draws on a
//       0.1 d grid) and with the former finite-source rule's 200 draws on a 0.25 d grid.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { cpus, loadavg } from "node:os";
import { proposePhotometryMapping } from "@/lib/event-photometry/mapping";
import { readEventPhotometry, readPhotometryFile } from "@/lib/event-photometry/read-event-photometry";
import { finiteSourceMagnification, finiteSourceMagnificationExact } from "@/lib/lensing/finite-source";
import { fitPointLens } from "@/lib/lensing/fit";
import { predictionOptionsOf } from "@/lib/lensing/fit-choices";
import { predictFromFit } from "@/lib/lensing/fit-prediction";
import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { bestSeconds } from "../lib/bench-sky";

const RHO = 0.01;
const LIMB_DARKENING_U = 0.5;
const GRID_POINTS = 600;
const REPEATS = 3;

console.log(`finite-source bench, load average ${loadavg().map((value) => value.toFixed(1)).join(" ")} on ${cpus().length} CPUs (timings of a shared machine are upper bounds)`);

const grid = Float64Array.from({ length: GRID_POINTS }, (_, i) => 0.05 + (2.95 * i) / (GRID_POINTS - 1));
let checksum = 0;
/** Per-call cost over the grid; the grid is swept `passes` times per run (the series is too quick to time once). */
function perCallUs(magnify: (u: number) => number, passes: number): number {
  const run = () => {
    for (let pass = 0; pass < passes; pass++) for (const u of grid) checksum += magnify(u);
  };
  for (let warm = 0; warm < 3; warm++) run(); // JIT warm-up
  return (bestSeconds(run, REPEATS) / (grid.length * passes)) * 1e6;
}
for (const a of [LIMB_DARKENING_U, 0]) {
  const exactUs = perCallUs((u) => finiteSourceMagnificationExact(u, RHO, a), 1);
  const newUs = perCallUs((u) => finiteSourceMagnification(u, RHO, a), 50);
  let worst = 0;
  for (const u of grid) worst = Math.max(worst, Math.abs(finiteSourceMagnification(u, RHO, a) / finiteSourceMagnificationExact(u, RHO, a) - 1));
  console.log(
    `(a) a = ${a}, ρ = ${RHO}, ${GRID_POINTS} offsets u = 0.05…3: quadrature alone ${exactUs.toFixed(2)} µs per call, now ${newUs.toFixed(3)} µs (${(exactUs / newUs).toFixed(0)}x faster); largest relative difference ${worst.toExponential(1)} (best of ${REPEATS})`,
  );
}

const table = readPhotometryFile(readFileSync(join(process.cwd(), "public", "demo", "cinder-avocet-photometry.csv")));
const direction = { raDeg: parseRightAscensionDeg("17 52 31.8"), decDeg: parseDeclinationDeg("-29 41 07") };
const { points } = readEventPhotometry(table, proposePhotometryMapping(table.columns, table.rows).mapping, { direction });
let fit = fitPointLens(points, { finiteSource: { limbDarkeningU: LIMB_DARKENING_U } });
const fitSeconds = bestSeconds(() => {
  fit = fitPointLens(points, { finiteSource: { limbDarkeningU: LIMB_DARKENING_U } });
}, 1);
console.log(
  `(b) limb-darkened (a = ${LIMB_DARKENING_U}) finite-source fit of the demo photometry (${points.length} points): ${fitSeconds.toFixed(2)} s (target 2 s: ${fitSeconds <= 2 ? "within" : "over"}), ${fit.iterations} LM iterations, converged ${fit.converged}, ρ = ${fit.rho?.toExponential(2)}, u0 = ${fit.u0.toFixed(4)}`,
);

const target = { ...direction, limbDarkeningU: LIMB_DARKENING_U };
const pageOptions = predictionOptionsOf(points, fit, target);
for (const [label, options] of [
  [`the page's options (${pageOptions.draws ?? 1000} draws, ${pageOptions.bandStepDays ?? 0.1} d grid)`, pageOptions],
  ["the former finite-source rule (200 draws, 0.25 d grid)", { ...pageOptions, draws: 200, bandStepDays: 0.25 }],
] as const) {
  let words = "";
  const seconds = bestSeconds(() => {
    const outcome = predictFromFit(fit, options);
    words = outcome.ok ? `A_peak ${outcome.prediction.peakMagnification.median.toFixed(3)}` : outcome.reason;
  }, 1);
  console.log(`(c) prediction from that fit with ${label}: ${seconds.toFixed(2)} s, ${words}`);
}
console.log(`[checksum ${checksum.toExponential(3)}]`);
