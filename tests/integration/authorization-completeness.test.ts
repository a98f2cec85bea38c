import { readdirSync, readFileSync } from "node:fs";
import { join, relative, sep } from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";
import { checkedByOwnTest, endpoints, openRoutes, serverActions, type RouteMethod } from "./support/authorization-table";

// Every route handler and server action the app can serve must have its role rules in the
// authorization matrix (or be listed as open by design). This test reads app/ itself, so a new route
// file or a new exported method fails here until it is added to support/authorization-table.ts.

const repoRoot = join(import.meta.dirname, "..", "..");
const appDir = join(repoRoot, "app");
const httpMethods = new Set(["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"]);

const sourceFiles = (dir: string) =>
  readdirSync(dir, { recursive: true, encoding: "utf8" })
    .filter((file) => /\.(ts|tsx)$/.test(file))
    .map((file) => join(dir, file));

const parse = (file: string) => ts.createSourceFile(file, readFileSync(file, "utf8"), ts.ScriptTarget.Latest, true);

/** The HTTP methods a route module exports, in every form Next accepts (const, destructuring, function, re-export). */
function exportedMethods(file: string): string[] {
  const names: string[] = [];
  const isExported = (node: ts.Node) => ts.canHaveModifiers(node) && ts.getModifiers(node)?.some((m) => m.kind === ts.SyntaxKind.ExportKeyword);
  for (const statement of parse(file).statements) {
    if (ts.isFunctionDeclaration(statement) && isExported(statement) && statement.name) names.push(statement.name.text);
    if (ts.isVariableStatement(statement) && isExported(statement)) {
      for (const declaration of statement.declarationList.declarations) {
        if (ts.isIdentifier(declaration.name)) names.push(declaration.name.text);
        if (ts.isObjectBindingPattern(declaration.name)) {
          for (const element of declaration.name.elements) if (ts.isIdentifier(element.name)) names.push(element.name.text);
        }
      }
    }
    if (ts.isExportDeclaration(statement) && statement.exportClause && ts.isNamedExports(statement.exportClause)) {
      for (const element of statement.exportClause.elements) names.push(element.name.text);
    }
  }
  return names.filter((name) => httpMethods.has(name));
}

/** "app/api/proposals/[proposalId]/route.ts" → "/api/proposals/[proposalId]" (route groups dropped). */
const routeOf = (file: string) =>
  `/${relative(appDir, file).split(sep).slice(0, -1).filter((part) => !/^\(.*\)$/.test(part)).join("/")}`;

function servedRoutes(): RouteMethod[] {
  return sourceFiles(appDir)
    .filter((file) => /(^|[\\/])route\.tsx?$/.test(file))
    .flatMap((file) => exportedMethods(file).map((method) => ({ method, route: routeOf(file) })));
}

/** Functions marked "use server", file-wide or inline, anywhere the app's code lives. */
function serverActionsInSource(): { file: string; action: string }[] {
  const found: { file: string; action: string }[] = [];
  for (const dir of ["app", "components", "lib"]) {
    for (const file of sourceFiles(join(repoRoot, dir))) {
      const source = parse(file);
      const isDirective = (s: ts.Statement) => ts.isExpressionStatement(s) && ts.isStringLiteral(s.expression) && s.expression.text === "use server";
      const fileWide = source.statements.some(isDirective);
      const visit = (node: ts.Node) => {
        const body = (ts.isFunctionDeclaration(node) || ts.isFunctionExpression(node) || ts.isArrowFunction(node)) && node.body && ts.isBlock(node.body) ? node.body : undefined;
        if (body?.statements.some(isDirective)) found.push({ file: relative(repoRoot, file), action: (ts.isFunctionDeclaration(node) && node.name?.text) || "(inline)" });
        ts.forEachChild(node, visit);
      };
      if (fileWide) found.push({ file: relative(repoRoot, file), action: "(every export)" });
      else visit(source);
    }
  }
  return found;
}

const key = ({ method, route }: RouteMethod) => `${method} ${route}`;
const listed = new Set([...endpoints.map((e) => key({ method: e.name.split(" ")[0], route: e.route })), ...checkedByOwnTest.map(key), ...openRoutes.map(key)]);

describe("authorization completeness", () => {
  const served = servedRoutes();

  it("finds the app's route handlers (the scan itself works)", () => {
    expect(served.length).toBeGreaterThanOrEqual(40);
    expect(served).toContainEqual({ method: "PATCH", route: "/api/proposals/[proposalId]/targets/[targetId]" });
    expect(served).toContainEqual({ method: "GET", route: "/api/auth/[...nextauth]" });
  });

  it("every route handler in app/ is in the authorization matrix, checked by its own named test, or open by design", () => {
    const missing = served.map(key).filter((k) => !listed.has(k));
    expect(missing, "add these to tests/integration/support/authorization-table.ts").toEqual([]);
  });

  it("the matrix names no route that the app does not serve (no stale entries)", () => {
    const servedKeys = new Set(served.map(key));
    expect([...listed].filter((k) => !servedKeys.has(k))).toEqual([]);
  });

  it("every matrix entry covers the six callers: signed out, non-member, viewer, Co-I, PI and site admin", () => {
    for (const endpoint of endpoints) {
      expect(endpoint.expected, endpoint.name).toHaveLength(5);
      expect(typeof endpoint.siteAdmin, endpoint.name).toBe("number");
    }
  });

  it("open routes read no session: their modules do not import the session or the access layer", () => {
    for (const open of openRoutes.filter((r) => !r.route.startsWith("/api/auth/") && r.route !== "/api/uploadthing" && r.sessionOnlyFor === undefined)) {
      const text = readFileSync(join(appDir, ...open.route.split("/").filter(Boolean), "route.ts"), "utf8");
      expect(text, open.route).not.toMatch(/sessionActor|getServerSession|lib\/server\/access/);
    }
  });

  it("every server action is listed with the test of its role rules", () => {
    const listedActions = new Set(serverActions.map((a) => `${a.file} ${a.action}`));
    expect(serverActionsInSource().filter((a) => !listedActions.has(`${a.file} ${a.action}`))).toEqual([]);
  });
});
