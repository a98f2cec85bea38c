import type { Page } from "playwright-core";
import { demoAccounts, demoProposal, type DemoAccount } from "@/db/seed/demo-scenario";

/** The seeded demo proposal's title, as its link reads on /proposals. */
export const demoProposalTitle = demoProposal.title;

/** Signs in through the password form and waits for the proposals list it lands on. */
export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto("/sign-in");
  const form = page.getByRole("form", { name: "Sign in with password" });
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("Password").fill(password);
  await form.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL("**/proposals");
}

/** Signs in as the seeded demo account of that role. */
export async function signInAsDemo(page: Page, key: DemoAccount["key"]): Promise<DemoAccount> {
  const account = demoAccounts.find((a) => a.key === key)!;
  await signIn(page, account.email, account.password);
  return account;
}
