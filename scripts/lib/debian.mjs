// Debian packages the scripts need, installed with apt-get when absent.
import { spawnSync } from "node:child_process";
import { log } from "./log.mjs";

let aptUpdated = false;

function isInstalled(pkg) {
  const result = spawnSync("dpkg-query", ["-W", "-f=${Status}", pkg], { encoding: "utf8" });
  return result.status === 0 && result.stdout.includes("install ok installed");
}

/** Installs the named Debian packages that are missing (as root), or explains what to install. */
export function ensureDebianPackages(packages) {
  const missing = packages.filter((pkg) => !isInstalled(pkg));
  if (missing.length === 0) return;
  if (process.getuid?.() !== 0) {
    throw new Error(`Missing Debian packages: ${missing.join(" ")}. Install them with: sudo apt-get install -y ${missing.join(" ")}`);
  }
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  if (!aptUpdated) {
    log("setup", "apt-get update");
    spawnSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
    aptUpdated = true;
  }
  log("setup", `apt-get install -y ${missing.join(" ")}`);
  const result = spawnSync("apt-get", ["install", "-y", "-qq", ...missing], { stdio: "inherit", env });
  if (result.status !== 0) throw new Error(`apt-get install ${missing.join(" ")} failed`);
}
