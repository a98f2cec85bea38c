import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { chmodSync, createWriteStream, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { Cluster } from "@/scripts/lib/postgres.mjs";
import { freePort, waitForHttp } from "@/scripts/lib/ports.mjs";

/**
 * What the resilience tests start for themselves, apart from the shared server the other browser
 * tests use: a throwaway PostgreSQL cluster they may stop and start, and app instances (`next start`
 * of the test build) they may kill. Everything is cleaned up by `stop()`/`destroy()` in `afterAll`.
 */

const repoRoot = resolve(fileURLToPath(import.meta.url), "../../../../..");
const bin = (name: string) => join(repoRoot, "node_modules", ".bin", name);
const clusterModule = join(repoRoot, "scripts", "lib", "postgres.mjs");

/** Runs a command to completion with its output in `logFile`; throws with the output's end on failure. */
function runLogged(command: string, args: string[], env: NodeJS.ProcessEnv, logFile: string): Promise<void> {
  return new Promise((done, fail) => {
    const log = createWriteStream(logFile, { flags: "a" });
    const child = spawn(command, args, { cwd: repoRoot, env, stdio: ["ignore", "pipe", "pipe"] });
    child.stdout.pipe(log, { end: false });
    child.stderr.pipe(log, { end: false });
    child.on("error", fail);
    child.on("exit", (code) => {
      log.end(() => {
        if (code === 0) done();
        else fail(new Error(`${command} ${args.join(" ")} failed (${code}):\n${tailOf(logFile)}`));
      });
    });
  });
}

/** The last lines of a log file, for a failure message. */
export function tailOf(logFile: string, lines = 40): string {
  try {
    return readFileSync(logFile, "utf8").split("\n").slice(-lines).join("\n");
  } catch {
    return "(no log)";
  }
}

/** The app's "unexpected error" reports (a 500's cause), each with the lines after it; the log's tail when there is none. */
export function unexpectedErrorsOf(logFile: string, linesEach = 25): string {
  try {
    const lines = readFileSync(logFile, "utf8").split("\n");
    const reports = lines.flatMap((line, index) => (line.includes("unexpected error") ? [lines.slice(index, index + linesEach).join("\n")] : []));
    return reports.length > 0 ? reports.slice(0, 3).join("\n---\n") : tailOf(logFile);
  } catch {
    return "(no log)";
  }
}

export interface TestCluster {
  /** Folder for this cluster and for the logs of everything the test starts. */
  root: string;
  port: number;
  url(database: string): string;
  /** Creates a database, applies the migrations and, with `seedDemo`, the demo scenario. */
  prepareDatabase(name: string, options?: { seedDemo?: boolean }): Promise<string>;
  /** `pg_ctl stop -m fast` without blocking this process, so requests in flight keep being timed. */
  stopServer(): Promise<void>;
  startServer(): Promise<void>;
  /** Stops the server and removes its folder. */
  destroy(): void;
}

/** A fresh cluster (fsync off) on a free loopback port, in a temporary folder `postgres` can reach. */
export async function startCluster(): Promise<TestCluster> {
  const root = mkdtempSync(join(tmpdir(), "arcwright-resilience-"));
  chmodSync(root, 0o755);
  const options = { root: join(root, "postgres"), port: await freePort(), password: randomBytes(18).toString("base64url"), throwaway: true };
  const cluster = new Cluster(options);
  cluster.initialize();
  cluster.start();
  // Stop and start go through a child process: Cluster's own calls block the event loop until
  // pg_ctl returns, which would stall (and mis-time) every request the test has in flight.
  const inChild = (method: "stop" | "start") =>
    runLogged(
      process.execPath,
      ["--input-type=module", "-e", `const { Cluster } = await import(${JSON.stringify(clusterModule)}); new Cluster(${JSON.stringify(options)}).${method}();`],
      process.env,
      join(root, "pg-ctl.log"),
    );
  return {
    root,
    port: options.port,
    url: (database) => cluster.url(database),
    async prepareDatabase(name, { seedDemo = false } = {}) {
      cluster.ensureDatabase(name);
      const env = { ...process.env, DATABASE_URL: cluster.url(name) };
      const logFile = join(root, `prepare-${name}.log`);
      await runLogged(bin("tsx"), ["scripts/migrate.ts"], env, logFile);
      if (seedDemo) await runLogged(bin("tsx"), ["scripts/seed.ts"], env, logFile);
      return cluster.url(name);
    },
    stopServer: () => inChild("stop"),
    startServer: () => inChild("start"),
    destroy() {
      cluster.stop();
      rmSync(root, { recursive: true, force: true });
    },
  };
}

export interface AppInstance {
  url: string;
  port: number;
  logFile: string;
  readonly process: ChildProcess;
  /** Whether the process has exited (by itself or killed). */
  readonly hasExited: boolean;
  /** SIGKILL, no chance to finish anything; resolves once the process is gone. */
  kill(): Promise<void>;
  /** SIGTERM, then SIGKILL after `graceMs`; resolves once the process is gone. */
  stop(graceMs?: number): Promise<void>;
}

export interface InstanceOptions {
  databaseUrl: string;
  /** Folder for the instance's log (the cluster's root). */
  logDir: string;
  name: string;
  /** A fixed port, e.g. to restart an instance where it was; a free one when omitted. */
  port?: number;
  /**
   * Served by scripts/serve.mjs with this many `next start` processes (as `npm start` serves it)
   * instead of one `next start`; `process` is then the launcher.
   */
  webProcesses?: number;
}

/**
 * `next start` (or scripts/serve.mjs) of the test build (ARCWRIGHT_DIST_DIR) on 127.0.0.1, with the test process's
 * environment except the database, its own public URL (links in mail point at it) and the upload
 * service's callback, which goes to this instance. Resolves once /api/health answers 200.
 */
export async function startInstance({ databaseUrl, logDir, name, port, webProcesses }: InstanceOptions): Promise<AppInstance> {
  const chosenPort = port ?? (await freePort());
  const url = `http://127.0.0.1:${chosenPort}`;
  const logFile = join(logDir, `${name}.log`);
  const log = createWriteStream(logFile, { flags: "a" });
  const address = ["-H", "127.0.0.1", "-p", String(chosenPort)];
  const [command, args] = webProcesses === undefined ? [bin("next"), ["start", ...address]] : [process.execPath, [join(repoRoot, "scripts", "serve.mjs"), ...address]];
  const child = spawn(command, args, {
    cwd: repoRoot,
    env: {
      ...process.env,
      ...(webProcesses === undefined ? {} : { ARCWRIGHT_WEB_PROCESSES: String(webProcesses) }),
      NODE_ENV: "production",
      DATABASE_URL: databaseUrl,
      NEXTAUTH_URL: url,
      UPLOADTHING_CALLBACK_URL: `${url}/api/uploadthing`,
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout?.pipe(log);
  child.stderr?.pipe(log);
  const exited = new Promise<void>((done) => child.once("exit", () => done()));
  const isGone = () => child.exitCode !== null || child.signalCode !== null;
  const waitGone = async (signal: NodeJS.Signals, graceMs: number) => {
    if (isGone()) return;
    child.kill(signal);
    const timer = setTimeout(() => child.kill("SIGKILL"), graceMs);
    await exited;
    clearTimeout(timer);
  };
  const instance: AppInstance = {
    url,
    port: chosenPort,
    logFile,
    process: child,
    get hasExited() {
      return isGone();
    },
    kill: () => waitGone("SIGKILL", 0),
    stop: (graceMs = 5_000) => waitGone("SIGTERM", graceMs),
  };
  try {
    await Promise.race([
      waitForHttp(`${url}/api/health`, { timeoutMs: 60_000 }),
      exited.then(() => {
        throw new Error(`${name} exited before answering:\n${tailOf(logFile)}`);
      }),
    ]);
  } catch (error) {
    await instance.stop();
    throw error;
  }
  return instance;
}
