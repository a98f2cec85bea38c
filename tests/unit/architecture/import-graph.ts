/**
 * The project's own import graph, read with the TypeScript compiler's parser (no type checking, no
 * bundler), and the three checks the architecture test runs on it: arrows between layers, import
 * cycles (Tarjan's strongly connected components) and client modules that reach server-only code.
 * Pure functions over a plain graph, so the test can also run each check on a small graph of its own.
 */
import { existsSync, readFileSync, readdirSync, statSync } from "node:fs";
import { join, posix } from "node:path";
import ts from "typescript";

/** One import of one module: `to` is a repository-relative path; `typeOnly` for `import type` and `typeof import()`. */
export interface Arrow {
  from: string;
  to: string;
  typeOnly: boolean;
}

/** What the checks need of one module. */
export interface ModuleNode {
  /** The module starts with the "use client" directive. */
  isClient: boolean;
  /** The module imports the "server-only" marker package. */
  importsServerOnly: boolean;
  arrows: Arrow[];
}

/** Modules by repository-relative path (posix separators). */
export type ModuleGraph = Map<string, ModuleNode>;

/** One module specifier as written, and whether only types come through it. */
export interface Specifier {
  text: string;
  typeOnly: boolean;
}

/** What the parser reads from one source file. */
export interface ParsedModule {
  specifiers: Specifier[];
  isClient: boolean;
}

const scriptKinds: Record<string, ts.ScriptKind> = { ".ts": ts.ScriptKind.TS, ".tsx": ts.ScriptKind.TSX, ".mjs": ts.ScriptKind.JS, ".js": ts.ScriptKind.JS };

/** The source extensions the graph follows, in the order a bare path is tried with them. */
export const sourceExtensions = [".ts", ".tsx", ".mjs", ".js"];

const isStringLike = (node: ts.Node | undefined): node is ts.StringLiteral | ts.NoSubstitutionTemplateLiteral =>
  node !== undefined && (ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node));

/** `import.meta.url`, the base of a worker's or asset's `new URL(...)`. */
const isImportMetaUrl = (node: ts.Node | undefined): boolean =>
  node !== undefined &&
  ts.isPropertyAccessExpression(node) &&
  node.name.text === "url" &&
  ts.isMetaProperty(node.expression) &&
  node.expression.keywordToken === ts.SyntaxKind.ImportKeyword;

/**
 * The module specifiers of one file: static imports (`import type` and side-effect imports included),
 * `export … from`, `import x = require()`, dynamic `import()`, `require()`, `typeof import()` types,
 * and `new URL("…", import.meta.url)` (how a worker entry is named). Also whether the file is a
 * client module: "use client" among the directives that open it.
 */
export function parseModule(fileName: string, text: string): ParsedModule {
  const extension = posix.extname(fileName);
  const source = ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, false, scriptKinds[extension] ?? ts.ScriptKind.TS);
  const specifiers: Specifier[] = [];

  const visit = (node: ts.Node): void => {
    if (ts.isImportDeclaration(node) && isStringLike(node.moduleSpecifier)) {
      const clause = node.importClause;
      const named = clause?.namedBindings;
      const everyNameIsType =
        clause !== undefined && clause.name === undefined && named !== undefined && ts.isNamedImports(named) && named.elements.length > 0 && named.elements.every((element) => element.isTypeOnly);
      specifiers.push({ text: node.moduleSpecifier.text, typeOnly: clause?.isTypeOnly === true || everyNameIsType });
    } else if (ts.isExportDeclaration(node) && node.moduleSpecifier !== undefined && isStringLike(node.moduleSpecifier)) {
      const named = node.exportClause;
      const everyNameIsType = named !== undefined && ts.isNamedExports(named) && named.elements.length > 0 && named.elements.every((element) => element.isTypeOnly);
      specifiers.push({ text: node.moduleSpecifier.text, typeOnly: node.isTypeOnly || everyNameIsType });
    } else if (ts.isImportEqualsDeclaration(node) && ts.isExternalModuleReference(node.moduleReference) && isStringLike(node.moduleReference.expression)) {
      specifiers.push({ text: node.moduleReference.expression.text, typeOnly: node.isTypeOnly });
    } else if (ts.isCallExpression(node) && isStringLike(node.arguments[0])) {
      const isDynamicImport = node.expression.kind === ts.SyntaxKind.ImportKeyword;
      const isRequire = ts.isIdentifier(node.expression) && node.expression.text === "require";
      if (isDynamicImport || isRequire) specifiers.push({ text: node.arguments[0].text, typeOnly: false });
    } else if (ts.isImportTypeNode(node) && ts.isLiteralTypeNode(node.argument) && isStringLike(node.argument.literal)) {
      specifiers.push({ text: node.argument.literal.text, typeOnly: true });
    } else if (ts.isNewExpression(node) && ts.isIdentifier(node.expression) && node.expression.text === "URL" && isStringLike(node.arguments?.[0]) && isImportMetaUrl(node.arguments?.[1])) {
      specifiers.push({ text: (node.arguments[0] as ts.StringLiteral).text, typeOnly: false });
    }
    ts.forEachChild(node, visit);
  };
  visit(source);

  let isClient = false;
  for (const statement of source.statements) {
    if (!ts.isExpressionStatement(statement) || !ts.isStringLiteral(statement.expression)) break;
    if (statement.expression.text === "use client") isClient = true;
  }
  return { specifiers, isClient };
}

/** A tsconfig `paths` entry of the `prefix/*` → `target/*` form. */
export interface PathAlias {
  prefix: string;
  target: string;
}

/** The `prefix/*` aliases of a tsconfig's `compilerOptions.paths` (the only form the project uses). */
export function pathAliasesOf(paths: Record<string, string[]>): PathAlias[] {
  return Object.entries(paths).map(([pattern, targets]) => {
    const target = targets[0];
    if (!pattern.endsWith("/*") || targets.length !== 1 || !target.endsWith("/*")) {
      throw new Error(`tsconfig paths: "${pattern}" is not of the "prefix/*": ["dir/*"] form the import graph reads`);
    }
    return { prefix: pattern.slice(0, -1), target: posix.normalize(target.slice(0, -1)) };
  });
}

/** How a specifier resolved: a project source module, another project file (a style sheet, JSON), or nothing. */
export type Resolution = { kind: "module"; path: string } | { kind: "asset"; path: string } | { kind: "unresolved" } | { kind: "package" };

/**
 * Resolves a specifier written in `fromPath` (both repository-relative) as the bundler does for this
 * project: an alias of `aliases` or a relative path, then the exact file, the path with each source
 * extension, a `.js` written for a `.ts` source, and the directory's `index` with each extension.
 * Anything else (a bare name) is a package. `isFile` answers for repository-relative paths.
 */
export function resolveSpecifier(fromPath: string, specifier: string, aliases: PathAlias[], isFile: (path: string) => boolean): Resolution {
  const alias = aliases.find((candidate) => specifier.startsWith(candidate.prefix));
  let base: string;
  if (alias !== undefined) base = posix.join(alias.target, specifier.slice(alias.prefix.length));
  else if (specifier.startsWith("./") || specifier.startsWith("../")) base = posix.join(posix.dirname(fromPath), specifier);
  else return { kind: "package" };

  const isSource = (path: string) => sourceExtensions.includes(posix.extname(path));
  const candidates = [
    base,
    ...sourceExtensions.map((extension) => base + extension),
    ...(posix.extname(base) === ".js" ? [".ts", ".tsx"].map((extension) => base.slice(0, -3) + extension) : []),
    ...sourceExtensions.map((extension) => posix.join(base, `index${extension}`)),
  ];
  const found = candidates.find(isFile);
  if (found === undefined) return { kind: "unresolved" };
  return isSource(found) ? { kind: "module", path: found } : { kind: "asset", path: found };
}

/** A specifier that names a project path and resolves to nothing: a parser or resolver gap, or a broken import. */
export interface UnresolvedImport {
  from: string;
  specifier: string;
}

/**
 * Builds the graph from source texts: every file of `roots`, and every project module they reach.
 * `read` returns a repository-relative file's text; `isFile` says whether a path is a file.
 */
export function buildGraph(
  roots: string[],
  aliases: PathAlias[],
  read: (path: string) => string,
  isFile: (path: string) => boolean,
): { graph: ModuleGraph; unresolved: UnresolvedImport[] } {
  const graph: ModuleGraph = new Map();
  const unresolved: UnresolvedImport[] = [];
  const queue = [...roots];
  while (queue.length > 0) {
    const path = queue.pop()!;
    if (graph.has(path)) continue;
    const { specifiers, isClient } = parseModule(path, read(path));
    const node: ModuleNode = { isClient, importsServerOnly: specifiers.some((s) => s.text === "server-only"), arrows: [] };
    graph.set(path, node);
    for (const specifier of specifiers) {
      const resolution = resolveSpecifier(path, specifier.text, aliases, isFile);
      if (resolution.kind === "unresolved") unresolved.push({ from: path, specifier: specifier.text });
      if (resolution.kind !== "module") continue;
      // Two imports of one module make one arrow, carrying values if either does.
      const same = node.arrows.find((arrow) => arrow.to === resolution.path);
      if (same !== undefined) same.typeOnly &&= specifier.typeOnly;
      else node.arrows.push({ from: path, to: resolution.path, typeOnly: specifier.typeOnly });
      queue.push(resolution.path);
    }
  }
  return { graph, unresolved };
}

/** The folders and files whose modules the architecture test reads. */
export const projectRoots = ["app", "components", "lib", "workers", "db", "scripts", "proxy.ts"];

/** Every source file (by extension) under `roots` of the repository at `repoRoot`, skipping dot folders and node_modules. */
export function listSourceFiles(repoRoot: string, roots: string[]): string[] {
  const files: string[] = [];
  const walk = (path: string): void => {
    const absolute = join(repoRoot, path);
    if (!existsSync(absolute)) return;
    if (statSync(absolute).isFile()) {
      if (sourceExtensions.includes(posix.extname(path))) files.push(path);
      return;
    }
    for (const entry of readdirSync(absolute, { withFileTypes: true })) {
      if (entry.name.startsWith(".") || entry.name === "node_modules") continue;
      walk(posix.join(path, entry.name));
    }
  };
  roots.forEach(walk);
  return files.sort();
}

/** The repository's graph, with its tsconfig's path aliases. */
export function readProjectGraph(repoRoot: string): { graph: ModuleGraph; unresolved: UnresolvedImport[]; fileCount: number } {
  const config = ts.readConfigFile(join(repoRoot, "tsconfig.json"), ts.sys.readFile);
  if (config.error !== undefined) throw new Error(`tsconfig.json: ${ts.flattenDiagnosticMessageText(config.error.messageText, "\n")}`);
  const aliases = pathAliasesOf(config.config.compilerOptions?.paths ?? {});
  const files = listSourceFiles(repoRoot, projectRoots);
  const isFile = (path: string) => !path.startsWith("..") && !path.split("/").includes("node_modules") && existsSync(join(repoRoot, path)) && statSync(join(repoRoot, path)).isFile();
  const { graph, unresolved } = buildGraph(files, aliases, (path) => readFileSync(join(repoRoot, path), "utf8"), isFile);
  return { graph, unresolved, fileCount: files.length };
}

/** Every arrow of the graph. */
export const arrowsOf = (graph: ModuleGraph): Arrow[] => [...graph.values()].flatMap((node) => node.arrows);

/** An arrow as the test's messages print it. */
export const formatArrow = (arrow: Arrow): string => `${arrow.from} → ${arrow.to}${arrow.typeOnly ? " (types only)" : ""}`;

/** A chain of arrows (a path through the graph) as the test's messages print it: a → b → c. */
export const formatChain = (chain: Arrow[]): string =>
  [chain[0].from, ...chain.map((arrow) => arrow.to + (arrow.typeOnly ? " (types only)" : ""))].join(" → ");

/** Tarjan's strongly connected components (R. Tarjan 1972, SIAM J. Comput. 1, 146), iterative so no call stack limits the graph's depth. */
export function stronglyConnectedComponents(graph: ModuleGraph): string[][] {
  const index = new Map<string, number>();
  const lowLink = new Map<string, number>();
  const onStack = new Set<string>();
  const stack: string[] = [];
  const components: string[][] = [];
  let counter = 0;
  const successors = (path: string) => (graph.get(path)?.arrows ?? []).map((arrow) => arrow.to).filter((to) => graph.has(to));

  for (const start of graph.keys()) {
    if (index.has(start)) continue;
    const frames: { path: string; next: string[]; at: number }[] = [];
    const enter = (path: string) => {
      index.set(path, counter);
      lowLink.set(path, counter);
      counter += 1;
      stack.push(path);
      onStack.add(path);
      frames.push({ path, next: successors(path), at: 0 });
    };
    enter(start);
    while (frames.length > 0) {
      const frame = frames[frames.length - 1];
      if (frame.at < frame.next.length) {
        const to = frame.next[frame.at];
        frame.at += 1;
        if (!index.has(to)) enter(to);
        else if (onStack.has(to)) lowLink.set(frame.path, Math.min(lowLink.get(frame.path)!, index.get(to)!));
        continue;
      }
      frames.pop();
      const parent = frames[frames.length - 1];
      if (parent !== undefined) lowLink.set(parent.path, Math.min(lowLink.get(parent.path)!, lowLink.get(frame.path)!));
      if (lowLink.get(frame.path) === index.get(frame.path)) {
        const component: string[] = [];
        let member: string;
        do {
          member = stack.pop()!;
          onStack.delete(member);
          component.push(member);
        } while (member !== frame.path);
        components.push(component.sort());
      }
    }
  }
  return components;
}

/** A shortest path of arrows (breadth first) from `from` to a module `isTarget` holds for, through modules `allowed` holds for; null if none. */
function shortestPath(graph: ModuleGraph, from: string, isTarget: (path: string) => boolean, allowed: (path: string) => boolean): Arrow[] | null {
  const cameBy = new Map<string, Arrow | null>([[from, null]]);
  const queue = [from];
  for (let head = 0; head < queue.length; head += 1) {
    for (const arrow of graph.get(queue[head])?.arrows ?? []) {
      if (isTarget(arrow.to)) {
        const path = [arrow];
        for (let step = cameBy.get(arrow.from); step; step = cameBy.get(step.from)) path.unshift(step);
        return path;
      }
      if (cameBy.has(arrow.to) || !allowed(arrow.to)) continue;
      cameBy.set(arrow.to, arrow);
      queue.push(arrow.to);
    }
  }
  return null;
}

/** One import cycle: the modules of a strongly connected component and one closed path through them. */
export interface ImportCycle {
  modules: string[];
  path: Arrow[];
}

/** The import cycles: each component of more than one module, or one module importing itself. */
export function importCycles(graph: ModuleGraph): ImportCycle[] {
  return stronglyConnectedComponents(graph)
    .filter((component) => component.length > 1 || (graph.get(component[0])?.arrows ?? []).some((arrow) => arrow.to === component[0]))
    .map((modules) => {
      const members = new Set(modules);
      const path = shortestPath(graph, modules[0], (path) => path === modules[0], (path) => members.has(path))!;
      return { modules, path };
    });
}

/**
 * A cycle as the test's messages print it: a → b → … → a; when more modules are tied together than
 * that loop shows, every arrow among them too (the ones to choose from when cutting the knot).
 */
export function formatCycle(graph: ModuleGraph, cycle: ImportCycle): string {
  const loop = formatChain(cycle.path);
  if (cycle.modules.length === cycle.path.length) return loop;
  const members = new Set(cycle.modules);
  const inside = cycle.modules.flatMap((path) => (graph.get(path)?.arrows ?? []).filter((arrow) => members.has(arrow.to)).map(formatArrow));
  return `${loop}; ${cycle.modules.length} modules are tied together, by these ${inside.length} arrows:\n    ${inside.join("\n    ")}`;
}

/**
 * For every client module, the shortest chain of imports (type imports included) to a module for
 * which `isServer` holds, if there is one. Only the first server module of a chain is shown.
 */
export function clientToServerChains(graph: ModuleGraph, isServer: (path: string, node: ModuleNode) => boolean): Arrow[][] {
  const serverPath = (path: string) => graph.has(path) && isServer(path, graph.get(path)!);
  return [...graph.entries()]
    .filter(([, node]) => node.isClient)
    .map(([path]) => shortestPath(graph, path, serverPath, () => true))
    .filter((chain): chain is Arrow[] => chain !== null);
}
