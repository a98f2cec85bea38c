import { fileURLToPath } from "node:url";
import tsParser from "@typescript-eslint/parser";
import { ESLint } from "eslint";
import regexp from "eslint-plugin-regexp";
import { describe, expect, it } from "vitest";

const repoRoot = fileURLToPath(new URL("../../..", import.meta.url));

/**
 * Every regular expression in the product's code must run in linear time on any input: one with
 * polynomial backtracking let a 3 KB request body hold a server process for seconds. The two rules of
 * eslint-plugin-regexp (built on scslre) find a pattern that backtracks super-linearly, and one whose
 * search restarts at each position of a long run (a quadratic "move"). Inline disable comments are
 * not honoured, so no pattern can opt out.
 */
async function superLinearPatterns(): Promise<string[]> {
  const eslint = new ESLint({
    cwd: repoRoot,
    overrideConfigFile: true,
    overrideConfig: [
      {
        files: ["**/*.ts", "**/*.tsx", "**/*.js", "**/*.mjs"],
        languageOptions: { parser: tsParser, parserOptions: { ecmaFeatures: { jsx: true } } },
        plugins: { regexp },
        linterOptions: { noInlineConfig: true, reportUnusedDisableDirectives: "off" },
        rules: { "regexp/no-super-linear-backtracking": "error", "regexp/no-super-linear-move": "error" },
      },
    ],
  });
  const results = await eslint.lintFiles(["lib", "app", "components"]);
  return results.flatMap((result) =>
    result.messages
      // With inline configuration off, ESLint also notes each disable comment it ignored.
      .filter((message) => message.ruleId?.startsWith("regexp/"))
      .map((message) => `${result.filePath.slice(repoRoot.length)}:${message.line}:${message.column} ${message.message}`),
  );
}

describe("regular expressions on user input", () => {
  it("has no pattern in lib/, app/ or components/ that backtracks or moves in super-linear time", async () => {
    expect(await superLinearPatterns()).toEqual([]);
  }, 60_000);
});
