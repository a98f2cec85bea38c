import type { Page } from "playwright-core";
import { expect } from "vitest";

/** The text a quantity field shows beside its input (`data-testid="echo-<name>"`), once it reads `expected`. */
export async function echoOf(page: Page, name: string, expected: RegExp): Promise<string> {
  const echo = page.getByTestId(`echo-${name}`);
  await expect.poll(async () => (await echo.count()) > 0 && expected.test((await echo.textContent()) ?? "")).toBe(true);
  return (await echo.textContent()) ?? "";
}
