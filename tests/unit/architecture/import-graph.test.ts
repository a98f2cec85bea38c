import { beforeAll, describe, expect, it } from "vitest";
import {
  type Arrow,
  type ModuleGraph,
  type ModuleNode,
  arrowsOf,
  buildGraph,
  clientToServerChains,
  formatArrow,
  formatChain,
  formatCycle,
  importCycles,
  parseModule,
  pathAliasesOf,
  readProjectGraph,
  resolveSpecifier,
  stronglyConnectedComponents,
} from "./import-graph";

/*
 * The rules the project's imports keep (our rules): dependencies point down, app → components → lib
 * → db, and code the browser loads never reaches server code. Every .ts, .tsx, .mjs and .js file under
 * app, components, lib, workers, db and scripts, and proxy.ts, is read; a type import is an arrow like
 * any other, since a type ties the two modules as firmly as a value does.
 */

/** A layering rule: no arrow from a module `from` holds for to a module `to` holds for, unless `allowed`. */
interface LayerRule {
  name: string;
  from: (path: string) => boolean;
  to: (path: string) => boolean;
  allowed?: (arrow: Arrow) => boolean;
}

const under = (...folders: string[]) => (path: string) => folders.some((folder) => path.startsWith(`${folder}/`));

/**
 * What the database layer proper (db/schema.ts, db/client.ts) may take from lib, and why: the one
 * reader of the environment (the connection string), and the two id lists its enum columns are
 * built from, so a new lens model or science case has one list to join. db/seed is no part of the
 * layer: it is a program (run by scripts/seed.ts) that writes the demo through the domain's own
 * schemas, password hashing and derived columns, like scripts/, so it may use lib.
 */
const libModulesTheDatabaseLayerNeeds = new Set(["lib/env.ts", "lib/lensing/registry.ts", "lib/lensing/science-case-inputs.ts"]);

const layerRules: LayerRule[] = [
  { name: "lib, workers and db import nothing of components or app", from: under("lib", "workers", "db"), to: under("components", "app") },
  { name: "components import nothing of app", from: under("components"), to: under("app") },
  {
    name: "the database layer imports of lib only the environment and the schema's id lists",
    from: (path) => path.startsWith("db/") && !path.startsWith("db/seed/"),
    to: under("lib"),
    allowed: (arrow) => libModulesTheDatabaseLayerNeeds.has(arrow.to),
  },
];

/** A server module: one that imports "server-only", or anything in lib/server. */
const isServerModule = (path: string, node: ModuleNode) => node.importsServerOnly || path.startsWith("lib/server/");

/** The arrows that break a layering rule. */
const breaches = (graph: ModuleGraph, rule: LayerRule): Arrow[] =>
  arrowsOf(graph).filter((arrow) => rule.from(arrow.from) && rule.to(arrow.to) && !(rule.allowed?.(arrow) ?? false));

/**
 * The client modules reaching server code, grouped by the arrow that enters the server module: that
 * arrow is the one to remove. Each line: the arrow, how many client modules reach through it, and one
 * shortest chain from a client module.
 */
function clientLeakReport(graph: ModuleGraph): string[] {
  const byEntry = new Map<string, Arrow[][]>();
  for (const chain of clientToServerChains(graph, isServerModule)) {
    const entry = formatArrow(chain[chain.length - 1]);
    byEntry.set(entry, [...(byEntry.get(entry) ?? []), chain]);
  }
  return [...byEntry.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([entry, chains]) => `${entry}: reached from ${chains.length} client module(s), e.g. ${formatChain(chains[0])}`);
}

const listing = (title: string, lines: string[]) => `${title} (${lines.length}; "(types only)" marks an arrow that carries only types):\n  ${lines.join("\n  ")}`;

describe("the project's import graph", () => {
  let project: ReturnType<typeof readProjectGraph>;
  // Read in a hook, not while the file is collected, so a read error fails these tests and not the checker's own.
  beforeAll(() => {
    project = readProjectGraph(process.cwd());
  });

  it("is read whole: every source file, and every specifier naming a project path resolves", () => {
    const { graph, unresolved, fileCount } = project;
    expect(fileCount).toBeGreaterThan(400);
    for (const path of ["proxy.ts", "db/schema.ts", "workers/fit.worker.ts", "scripts/test.mjs", "app/layout.tsx"]) expect(graph.has(path), path).toBe(true);
    // The worker entries are reached through `new URL(…, import.meta.url)`, not an import statement.
    expect(arrowsOf(graph).filter((arrow) => arrow.to.startsWith("workers/") && arrow.to.endsWith(".worker.ts")).length).toBeGreaterThanOrEqual(4);
    expect(unresolved.map(({ from, specifier }) => `${from}: "${specifier}"`), "specifiers that resolve to no file").toEqual([]);
  });

  for (const rule of layerRules) {
    it(rule.name, () => {
      const found = breaches(project.graph, rule).map(formatArrow).sort();
      expect(found, listing(`arrows breaking "${rule.name}"`, found)).toEqual([]);
    });
  }

  it("has no import cycle", () => {
    const cycles = importCycles(project.graph).map((cycle) => formatCycle(project.graph, cycle)).sort();
    expect(cycles, listing("import cycles", cycles)).toEqual([]);
  });

  it('has no "use client" module reaching a server module (one importing "server-only", or in lib/server) through its imports', () => {
    const leaks = clientLeakReport(project.graph);
    expect(leaks, listing("arrows into server modules from code the browser loads", leaks)).toEqual([]);
  });
});

/** A graph of a few modules written as `from: [to, …]`; a "type:" prefix marks a type-only arrow. */
function graphOf(modules: Record<string, string[]>, marks: { client?: string[]; serverOnly?: string[] } = {}): ModuleGraph {
  return new Map(
    Object.entries(modules).map(([from, targets]) => [
      from,
      {
        isClient: marks.client?.includes(from) ?? false,
        importsServerOnly: marks.serverOnly?.includes(from) ?? false,
        arrows: targets.map((target) => ({ from, to: target.replace(/^type:/, ""), typeOnly: target.startsWith("type:") })),
      },
    ]),
  );
}

describe("the import-graph checker on graphs of its own (each rule can fail)", () => {
  it("reads every kind of specifier, type imports marked, and the use-client directive", () => {
    const source = [
      '"use client";',
      'import "server-only";',
      'import type { A } from "@/lib/a";',
      'import { type B, type C } from "./b";',
      'import D, { type E } from "../d";',
      'export { F } from "@/lib/f";',
      'export type { G } from "@/lib/g";',
      'const H = dynamic(() => import("@/components/h"));',
      'const worker = new Worker(new URL("../workers/x.worker.ts", import.meta.url), { type: "module" });',
      'const page = new URL("/elsewhere", "https://example.org");',
      'type R = typeof import("react-dom/server");',
      'const fs = require("node:fs");',
    ].join("\n");
    const { specifiers, isClient } = parseModule("components/z.tsx", source);
    expect(isClient).toBe(true);
    expect(specifiers).toEqual([
      { text: "server-only", typeOnly: false },
      { text: "@/lib/a", typeOnly: true },
      { text: "./b", typeOnly: true },
      { text: "../d", typeOnly: false },
      { text: "@/lib/f", typeOnly: false },
      { text: "@/lib/g", typeOnly: true },
      { text: "@/components/h", typeOnly: false },
      { text: "../workers/x.worker.ts", typeOnly: false },
      { text: "react-dom/server", typeOnly: true },
      { text: "node:fs", typeOnly: false },
    ]);
    expect(parseModule("lib/y.ts", '// "use client"\nimport x from "./x";\n"use client";').isClient).toBe(false);
  });

  it("resolves aliases and relative paths with extensions, .js written for .ts, and index files; bare names are packages", () => {
    const aliases = pathAliasesOf({ "@/*": ["./*"] });
    const files = new Set(["lib/a.ts", "lib/b/index.tsx", "scripts/lib/c.mjs", "scripts/d.ts", "app/globals.css"]);
    const resolve = (from: string, specifier: string) => resolveSpecifier(from, specifier, aliases, (path) => files.has(path));
    expect(resolve("app/page.tsx", "@/lib/a")).toEqual({ kind: "module", path: "lib/a.ts" });
    expect(resolve("lib/x/y.ts", "../b")).toEqual({ kind: "module", path: "lib/b/index.tsx" });
    expect(resolve("scripts/test.mjs", "./lib/c.mjs")).toEqual({ kind: "module", path: "scripts/lib/c.mjs" });
    expect(resolve("scripts/e.ts", "./d.js")).toEqual({ kind: "module", path: "scripts/d.ts" });
    expect(resolve("app/layout.tsx", "./globals.css")).toEqual({ kind: "asset", path: "app/globals.css" });
    expect(resolve("app/page.tsx", "@/lib/missing")).toEqual({ kind: "unresolved" });
    expect(resolve("app/page.tsx", "react")).toEqual({ kind: "package" });
    expect(() => pathAliasesOf({ "@lib": ["./lib"] })).toThrow(/prefix/);
  });

  it("builds arrows from texts and reports a project specifier that resolves to nothing", () => {
    const texts: Record<string, string> = {
      "components/panel.tsx": '"use client";\nimport type { A } from "@/lib/a";\nimport { a } from "@/lib/a";\nimport "@/lib/gone";',
      "lib/a.ts": 'import "server-only";\nexport const a = 1;',
    };
    const { graph, unresolved } = buildGraph(["components/panel.tsx"], pathAliasesOf({ "@/*": ["./*"] }), (path) => texts[path], (path) => path in texts);
    expect([...graph.keys()].sort()).toEqual(["components/panel.tsx", "lib/a.ts"]);
    expect(graph.get("lib/a.ts")!.importsServerOnly).toBe(true);
    expect(arrowsOf(graph)).toEqual([{ from: "components/panel.tsx", to: "lib/a.ts", typeOnly: false }]);
    expect(unresolved).toEqual([{ from: "components/panel.tsx", specifier: "@/lib/gone" }]);
  });

  it("finds each layering breach, and lets the database layer's allowed imports and the seed through", () => {
    const graph = graphOf({
      "lib/physics/a.ts": ["components/scene/b.tsx"],
      "workers/w.worker.ts": ["type:app/page.tsx"],
      "components/c.tsx": ["app/layout.tsx", "lib/physics/a.ts"],
      "db/schema.ts": ["lib/lensing/registry.ts", "lib/workspace/status.ts"],
      "db/seed/demo.ts": ["lib/server/derived-columns.ts"],
      "db/seed/bad.ts": ["components/c.tsx"],
      "app/page.tsx": ["components/c.tsx", "lib/physics/a.ts"],
    });
    expect(layerRules.map((rule) => breaches(graph, rule).map(formatArrow))).toEqual([
      ["lib/physics/a.ts → components/scene/b.tsx", "workers/w.worker.ts → app/page.tsx (types only)", "db/seed/bad.ts → components/c.tsx"],
      ["components/c.tsx → app/layout.tsx"],
      ["db/schema.ts → lib/workspace/status.ts"],
    ]);
  });

  it("finds every cycle, with its path, by Tarjan's components", () => {
    const graph = graphOf({
      "lib/a.ts": ["lib/b.ts"],
      "lib/b.ts": ["lib/c.ts", "lib/d.ts"],
      "lib/c.ts": ["type:lib/a.ts"],
      "lib/d.ts": ["lib/e.ts"],
      "lib/e.ts": ["lib/e.ts"],
      "lib/f.ts": ["lib/a.ts"],
    });
    expect(stronglyConnectedComponents(graph).map((component) => component.join(",")).sort()).toEqual(["lib/a.ts,lib/b.ts,lib/c.ts", "lib/d.ts", "lib/e.ts", "lib/f.ts"]);
    expect(importCycles(graph).map((cycle) => formatCycle(graph, cycle)).sort()).toEqual(["lib/a.ts → lib/b.ts → lib/c.ts → lib/a.ts (types only)", "lib/e.ts → lib/e.ts"]);
    const knot = graphOf({ "lib/a.ts": ["lib/b.ts", "lib/c.ts"], "lib/b.ts": ["lib/a.ts"], "lib/c.ts": ["lib/a.ts"] });
    expect(importCycles(knot).map((cycle) => formatCycle(knot, cycle))).toEqual([
      "lib/a.ts → lib/b.ts → lib/a.ts; 3 modules are tied together, by these 4 arrows:\n    lib/a.ts → lib/b.ts\n    lib/a.ts → lib/c.ts\n    lib/b.ts → lib/a.ts\n    lib/c.ts → lib/a.ts",
    ]);
    expect(importCycles(graphOf({ "lib/a.ts": ["lib/b.ts"], "lib/b.ts": [] }))).toEqual([]);
  });

  it("finds a client module reaching a server module through a type import, and not one that stops short", () => {
    const graph = graphOf(
      {
        "components/form.tsx": ["components/shared/field.tsx"],
        "components/shared/field.tsx": ["type:lib/workspace/views.ts"],
        "lib/workspace/views.ts": ["lib/server/targets.ts"],
        "lib/server/targets.ts": [],
        "components/plain.tsx": ["lib/exports/secret.ts"],
        "lib/exports/secret.ts": [],
        "components/safe.tsx": ["lib/physics/a.ts"],
        "lib/physics/a.ts": [],
        "app/page.tsx": ["lib/server/targets.ts"],
      },
      { client: ["components/form.tsx", "components/plain.tsx", "components/safe.tsx"], serverOnly: ["lib/exports/secret.ts"] },
    );
    expect(clientLeakReport(graph)).toEqual([
      "components/plain.tsx → lib/exports/secret.ts: reached from 1 client module(s), e.g. components/plain.tsx → lib/exports/secret.ts",
      "lib/workspace/views.ts → lib/server/targets.ts: reached from 1 client module(s), e.g. components/form.tsx → components/shared/field.tsx → lib/workspace/views.ts (types only) → lib/server/targets.ts",
    ]);
  });
});
