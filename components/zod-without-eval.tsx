"use client";

import { z } from "zod";

// zod compiles object schemas with `new Function` when it may, and probes for that on first use. The
// pages' Content-Security-Policy forbids eval, so in the browser it validates without compiling, and
// the probe no longer shows up as a policy violation.
z.config({ jitless: true });

/** Rendered once in the root layout so the setting above runs before any page validates input. */
export function ZodWithoutEval() {
  return null;
}
