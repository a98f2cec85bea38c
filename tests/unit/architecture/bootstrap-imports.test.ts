import { readFileSync } from "node:fs";
import { builtinModules } from "node:module";
import { dirname, join, relative, resolve } from "node:path";
import { describe, expect, it } from "vitest";

/**
 * The scripts that install the npm packages (`ensureNodeModules`, `npm ci`) run on a fresh clone before
 * node_modules exists, so everything they load statically must be Node's own or the scripts' own
 * modules; a package is loaded with import() or require() inside the function that needs it, after the
 * install. A static `import … from "get-port"` in one of them failed `npm test` on a fresh clone.
 */
const root = resolve(__dirname, "../../..");
const entryScripts = ["scripts/test.mjs", "scripts/start.mjs", "scripts/bench.mjs", "scripts/load/run.mjs"];

/** The specifiers of a module's static imports and re-exports (not import() calls). */
function staticSpecifiers(source: string): string[] {
  const pattern = /^\s*(?:import|export)\s+(?:[^"'();]*?\sfrom\s+)?["']([^"']+)["']/gm;
  return [...source.matchAll(pattern)].map((match) => match[1]);
}

/** Every static import reached from `entry`, as [importing file, specifier]. */
function staticImportsFrom(entry: string): [string, string][] {
  const seen = new Set<string>();
  const found: [string, string][] = [];
  const visit = (file: string) => {
    if (seen.has(file)) return;
    seen.add(file);
    for (const specifier of staticSpecifiers(readFileSync(file, "utf8"))) {
      found.push([relative(root, file), specifier]);
      if (specifier.startsWith(".")) visit(join(dirname(file), specifier));
    }
  };
  visit(join(root, entry));
  return found;
}

const isNodeOwn = (specifier: string) => specifier.startsWith("node:") || builtinModules.includes(specifier);

describe("the set-up scripts load no npm package before installing them", () => {
  it("reads a module's static imports, not its import() calls", () => {
    expect(staticSpecifiers('import a from "x";\nimport { b,\n c } from "./y.mjs";\nimport "z";\nexport { d } from "w";\nconst e = await import("v");')).toEqual(["x", "./y.mjs", "z", "w"]);
  });

  for (const entry of entryScripts) {
    it(`${entry} reaches only Node's modules and the scripts' own`, () => {
      const imports = staticImportsFrom(entry);
      expect(imports.length).toBeGreaterThan(5);
      expect(imports.filter(([, specifier]) => !specifier.startsWith(".") && !isNodeOwn(specifier)).map(([file, specifier]) => `${file} → ${specifier}`)).toEqual([]);
    });
  }
});
