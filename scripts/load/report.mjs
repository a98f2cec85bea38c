// What the load run counts, and the figures it prints. Targets are printed as met/missed beside the
// figures; timing never fails the run, a request that errored or answered non-2xx does.
import { cpus, loadavg } from "node:os";

/** Targets from the load issue (#9, item 1). */
const performanceTargets = { readP95Ms: 100, errors: 0 };

/** Every answer of the run, kept per request kind (latencies in ms, all of them, for exact percentiles). */
export class Recorder {
  constructor(kindNames) {
    this.kinds = new Map(kindNames.map((name) => [name, { latenciesMs: [], non2xx: 0, errors: 0, bytes: 0, samples: [], errorKinds: new Map() }]));
  }

  response(kind, status, latencyMs, bytes) {
    const k = this.kinds.get(kind);
    k.latenciesMs.push(latencyMs);
    k.bytes += bytes;
    if (status < 200 || status >= 300) k.non2xx += 1;
  }

  error(kind, error) {
    const k = this.kinds.get(kind);
    k.errors += 1;
    const what = error.code ?? error.message;
    k.errorKinds.set(what, (k.errorKinds.get(what) ?? 0) + 1);
  }

  /** Requests that errored or answered non-2xx, over every kind. */
  failures() {
    return [...this.kinds.values()].reduce((sum, k) => sum + k.errors + k.non2xx, 0);
  }

  /** Keeps the first few non-2xx answers of a kind, to show what went wrong. */
  sample(kind, text) {
    const k = this.kinds.get(kind);
    if (k.samples.length < 3) k.samples.push(text);
  }
}

/** Nearest-rank percentile of sorted values (the common-practice definition: no interpolation). */
function percentile(sorted, p) {
  if (sorted.length === 0) return NaN;
  const rank = Math.ceil((p / 100) * sorted.length);
  return sorted[Math.min(sorted.length, Math.max(1, rank)) - 1];
}

function summarize(label, parts, elapsedSeconds) {
  const latencies = Float64Array.from(parts.flatMap((k) => k.latenciesMs)).sort();
  const requests = latencies.length;
  const sum = (field) => parts.reduce((total, k) => total + k[field], 0);
  return {
    label,
    requests,
    perSecond: requests / elapsedSeconds,
    mean: requests > 0 ? latencies.reduce((total, v) => total + v, 0) / requests : NaN,
    p50: percentile(latencies, 50),
    p95: percentile(latencies, 95),
    p99: percentile(latencies, 99),
    max: requests > 0 ? latencies[requests - 1] : NaN,
    meanBytes: requests > 0 ? sum("bytes") / requests : NaN,
    non2xx: sum("non2xx"),
    errors: sum("errors"),
  };
}

const ms = (value) => (Number.isNaN(value) ? "-" : value.toFixed(1));
const columns = [
  ["kind", 28, (r) => r.label],
  ["requests", 9, (r) => String(r.requests)],
  ["req/s", 8, (r) => r.perSecond.toFixed(1)],
  ["mean ms", 8, (r) => ms(r.mean)],
  ["p50 ms", 8, (r) => ms(r.p50)],
  ["p95 ms", 8, (r) => ms(r.p95)],
  ["p99 ms", 8, (r) => ms(r.p99)],
  ["max ms", 8, (r) => ms(r.max)],
  ["bytes/resp", 11, (r) => (Number.isNaN(r.meanBytes) ? "-" : String(Math.round(r.meanBytes)))],
  ["non-2xx", 8, (r) => String(r.non2xx)],
  ["errors", 7, (r) => String(r.errors)],
];
const row = (cells) => cells.map((cell, i) => (i === 0 ? cell.padEnd(columns[i][1]) : cell.padStart(columns[i][1]))).join(" ");

/** The machine the run shared with the app, PostgreSQL and the load generator itself. */
export function machineLine() {
  const cores = cpus();
  const [one, five, fifteen] = loadavg().map((v) => v.toFixed(2));
  return `${cores.length} cores (${cores[0]?.model.trim() ?? "unknown"}), load average ${one} / ${five} / ${fifteen} (1 / 5 / 15 min)`;
}

/**
 * CPU time per request of the mix, and the throughput it allows: each app process runs on one core at
 * most, and the app and PostgreSQL together share every core.
 */
function costLines(cpuMs, requests, appProcesses) {
  const per = (value) => value / requests;
  const serverMs = per(cpuMs.app) + per(cpuMs.database);
  const capacity = Math.min((Math.min(appProcesses, cpus().length) * 1000) / per(cpuMs.app), (cpus().length * 1000) / serverMs);
  return [
    `CPU per request: app ${per(cpuMs.app).toFixed(2)} ms (${appProcesses} processes together), PostgreSQL ${per(cpuMs.database).toFixed(2)} ms, load generator ${per(cpuMs.generator).toFixed(2)} ms`,
    `at that cost the app and PostgreSQL alone, on ${cpus().length} otherwise idle cores, answer at most about ${capacity.toFixed(0)} req/s of this mix`,
  ];
}

/**
 * Prints the table and the targets; returns the number of failed requests (errors plus non-2xx).
 * @param {{ kinds: { name: string, label: string }[], recorder: Recorder, elapsedSeconds: number, connections: number, isPaced: boolean, cpuMs: { app: number, database: number, generator: number } | null, appProcesses: number, settings: string, machineBefore: string }} run
 */
export function printReport({ kinds, recorder, elapsedSeconds, connections, isPaced, cpuMs, appProcesses, settings, machineBefore }) {
  const rows = kinds.map((kind) => summarize(`${kind.name}: ${kind.label}`, [recorder.kinds.get(kind.name)], elapsedSeconds));
  const all = summarize("all", [...recorder.kinds.values()], elapsedSeconds);
  const out = [
    "",
    `load run: ${settings}, ${elapsedSeconds.toFixed(1)} s measured`,
    `machine before: ${machineBefore}`,
    `machine after:  ${machineLine()}`,
    "latencies are from request sent to response read, on loopback, over every answer of the kind",
    row(columns.map(([name]) => name)),
    ...[...rows, all].map((r) => row(columns.map(([, , cell]) => cell(r)))),
  ];
  if (!isPaced) {
    // Little's law (L = λW): with every connection always waiting on one answer, L is the connection count.
    out.push(`closed loop: mean latency = connections / throughput = ${connections} / ${all.perSecond.toFixed(1)} req/s = ${ms((connections / all.perSecond) * 1000)} ms (Little's law)`);
  }
  if (cpuMs && all.requests > 0) out.push(...costLines(cpuMs, all.requests, appProcesses));
  for (const kind of kinds) {
    const k = recorder.kinds.get(kind.name);
    for (const [what, count] of k.errorKinds) out.push(`  ${kind.name} errors: ${count} × ${what}`);
    for (const text of k.samples) out.push(`  ${kind.name} non-2xx answer: ${text}`);
  }
  const reads = rows[kinds.findIndex((kind) => kind.name === "read")];
  const failed = all.errors + all.non2xx;
  const verdict = (isMet) => (isMet ? "met" : "missed");
  out.push(
    `target: zero errors (errors + non-2xx = ${failed}): ${verdict(failed === performanceTargets.errors)}`,
    isPaced
      ? `target: reads p95 < ${performanceTargets.readP95Ms} ms for paced clients (p95 = ${ms(reads.p95)} ms): ${verdict(reads.p95 < performanceTargets.readP95Ms)}`
      : // Back to back, latency is connections / throughput whatever the app does: 100 ms at 100
        // connections would take 1,000 req/s. This mode measures throughput; the latency target is the paced run's.
        `reads p95 = ${ms(reads.p95)} ms: a closed loop sets latency by its throughput (above); the ${performanceTargets.readP95Ms} ms target is checked by the paced run (without --closed-loop)`,
  );
  process.stdout.write(`${out.join("\n")}\n`);
  return failed;
}
