/** Strips escaped braces and comments, then checks { } balance never goes negative and ends at zero. */
export function bracesBalance(tex: string): boolean {
  let depth = 0;
  for (const c of tex.replace(/\\[{}%]/g, "").replace(/%.*$/gm, "")) {
    if (c === "{") depth++;
    if (c === "}" && --depth < 0) return false;
  }
  return depth === 0;
}
