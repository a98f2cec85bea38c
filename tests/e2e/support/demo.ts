import type { APIRequestContext, Page } from "playwright-core";
import { expect } from "vitest";
import { demoAccounts, demoProposal, demoSite, type DemoAccount } from "@/db/seed/demo-scenario";
import { baseUrl } from "./browser";

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

/**
 * A proposal of the test's own at the demo site (so the seeded demo proposal stays as other tests
 * expect it), created through the API by the signed-in caller whose `request` this is, and a target
 * in it; answers their ids. `proposal` and `target` are the API's bodies, the site filled in.
 */
export async function createOwnTarget(request: APIRequestContext, proposal: Record<string, unknown>, target: Record<string, unknown>): Promise<{ proposalId: string; targetId: string }> {
  const created = await request.post(`${baseUrl}/api/proposals`, { data: { site: demoSite, ...proposal } });
  expect(created.status(), await created.text()).toBe(201);
  const proposalId = ((await created.json()) as { proposal: { id: string } }).proposal.id;
  const added = await request.post(`${baseUrl}/api/proposals/${proposalId}/targets`, { data: target });
  expect(added.status(), await added.text()).toBe(201);
  return { proposalId, targetId: ((await added.json()) as { target: { id: string } }).target.id };
}
