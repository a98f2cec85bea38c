/**
 * Argument checks shared by the physics modules. Each throws a RangeError whose message names the
 * argument, the value received and the domain, so that a UI can show it beside the field.
 */

function describe(value: number): string {
  return Number.isNaN(value) ? "NaN" : String(value);
}

/** Throws unless `value` is a finite number. */
export function requireFinite(name: string, value: number): void {
  if (!Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number, got ${describe(value)}`);
  }
}

/** Throws unless `value` is finite and > 0. */
export function requirePositive(name: string, value: number): void {
  if (!(Number.isFinite(value) && value > 0)) {
    throw new RangeError(`${name} must be a finite number > 0, got ${describe(value)}`);
  }
}

/** Throws unless `value` is finite and >= 0. */
export function requireNonNegative(name: string, value: number): void {
  if (!(Number.isFinite(value) && value >= 0)) {
    throw new RangeError(`${name} must be a finite number >= 0, got ${describe(value)}`);
  }
}

/** Throws with a domain described in words (for domains that depend on other arguments). */
export function domainError(name: string, value: number, domain: string): RangeError {
  return new RangeError(`${name} must be ${domain}, got ${describe(value)}`);
}
