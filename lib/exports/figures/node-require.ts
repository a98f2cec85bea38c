import "server-only";
import { createRequire } from "node:module";
import { join } from "node:path";

/**
 * Loads a package with Node's own `require`, outside the Next bundle. Two export packages cannot be
 * bundled into a route handler: resvg's native addon (Turbopack cannot place a .node file) and pdfkit
 * (reads its data files next to its own sources). The name is passed as a value so the bundler leaves
 * the call alone; under vitest this is an ordinary require.
 */
export function nodeRequire<T>(packageName: string): T {
  return createRequire(join(process.cwd(), "package.json"))(packageName) as T;
}
