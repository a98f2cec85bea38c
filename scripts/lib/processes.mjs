// Child processes of a run, stopped together (and waited for) however the run ends.
import { spawn } from "node:child_process";
import { log } from "./log.mjs";

const children = new Set();

/** Starts a long-running child with inherited output; it is stopped by `stopAll`. */
export function startChild(name, command, args, options = {}) {
  const child = spawn(command, args, { stdio: "inherit", ...options });
  child.arcwrightName = name;
  children.add(child);
  child.on("exit", () => children.delete(child));
  return child;
}

/** Runs a command to completion; resolves with its exit code. */
export function run(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: "inherit", ...options });
    children.add(child);
    child.on("error", reject);
    child.on("exit", (code, signal) => {
      children.delete(child);
      resolve(code ?? (signal ? 1 : 0));
    });
  });
}

/** Runs a command and throws when it fails. */
export async function runOrThrow(label, command, args, options = {}) {
  const code = await run(command, args, options);
  if (code !== 0) throw new Error(`${label} failed with exit code ${code}`);
}

/** Sends SIGTERM to every child, then SIGKILL to any still alive after `graceMs`. */
export async function stopAll(graceMs = 8_000) {
  const alive = [...children].filter((c) => c.exitCode === null && c.signalCode === null);
  await Promise.all(
    alive.map(
      (child) =>
        new Promise((resolve) => {
          const timer = setTimeout(() => {
            log("stop", `${child.arcwrightName ?? child.pid} did not stop in time; killing`);
            child.kill("SIGKILL");
          }, graceMs);
          child.once("exit", () => {
            clearTimeout(timer);
            resolve();
          });
          child.kill("SIGTERM");
        }),
    ),
  );
}

/** Runs a command to completion, echoing its output; resolves with the output, throws when it fails. */
export function runCapturing(label, command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { ...options, stdio: ["ignore", "pipe", "inherit"] });
    children.add(child);
    let output = "";
    child.stdout.on("data", (chunk) => {
      output += chunk;
      process.stdout.write(chunk);
    });
    child.on("error", reject);
    child.on("exit", (code) => {
      children.delete(child);
      if (code === 0) resolve(output);
      else reject(new Error(`${label} failed with exit code ${code}`));
    });
  });
}
