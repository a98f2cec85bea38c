// One line per event, prefixed with the part of the system that speaks.
export function log(part, message) {
  process.stdout.write(`[${part}] ${message}\n`);
}
