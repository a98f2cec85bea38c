import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseUrl, launchBrowser, newPage } from "./support/browser";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const run = Date.now().toString(36);
const piEmail = `pi-${run}@example.org`;
const colleagueEmail = `colleague-${run}@example.org`;

/** Fills the sign-up form, then follows the confirmation link from the local mailbox, as a new member does. */
async function signUp(page: Page, name: string, password: string) {
  const email = await page.getByLabel("E-mail").inputValue();
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Create account" }).click();
  await page.getByRole("status").getByText("Check your e-mail").waitFor();
  // The message leaves in the background; the mailbox shows it a moment later.
  const mail = page.getByTestId("mail").filter({ hasText: email }).filter({ hasText: "Confirm your Arcwright account" });
  await expect
    .poll(async () => {
      await page.goto("/dev/mailbox");
      return mail.count();
    })
    .toBe(1);
  await mail.getByRole("link", { name: /\/sign-in\/link\?token=/ }).click();
  await page.getByRole("button", { name: "Sign in to Arcwright" }).click();
}

describe("team workspace in the browser", () => {
  it("sign up, create a proposal, add a target, invite a colleague who accepts as a read-only viewer", async () => {
    const pi = await newPage(browser);
    const { page } = pi;

    await page.goto("/sign-up");
    await page.getByLabel("E-mail").fill(piEmail);
    await signUp(page, "Mira Quenneville", "quenneville-e2e-pass");
    await page.waitForURL("**/proposals");
    await expect(page.getByTestId("account-menu").textContent()).resolves.toContain("Mira Quenneville");

    const form = page.getByRole("form", { name: "New proposal" });
    await form.getByLabel("Title").fill("Microlensing toward the Ashgrove field");
    await form.getByLabel("Observing cycle").fill("2032B");
    await form.getByLabel("Site name").fill("Ridge Hollow test site");
    await form.getByLabel("Latitude (deg)").fill("-30.2");
    await form.getByLabel("Longitude (deg, east +)").fill("-70.7");
    await form.getByLabel("Elevation (m)").fill("2200");
    await form.getByLabel("Resolution (mas)").fill("40");
    await form.getByLabel("Cadence (hours)").fill("6");
    await form.getByLabel("Campaign length (days)").fill("100");
    await form.getByRole("button", { name: "Create proposal" }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    const proposalUrl = page.url();
    const proposalId = proposalUrl.split("/").pop()!;
    await expect(page.getByTestId("my-role").textContent()).resolves.toBe("PI");

    const add = page.getByRole("form", { name: "Add a target" });
    await add.getByLabel("Target name").fill("ASH-32-0001");
    await add.getByLabel("Right ascension").fill("17 59 02.3");
    await add.getByLabel("Declination").fill("-29 33 10");
    await add.getByLabel("Lens mass (M☉)").fill("0.5");
    await add.getByLabel("Lens distance (pc)").fill("4000");
    await add.getByLabel("Source distance (pc)").fill("8000");
    await add.getByLabel("Relative proper motion (mas/yr)").fill("5");
    await add.getByRole("button", { name: "Add target" }).click();
    // θ_E = sqrt(4 G M/c² · D_LS/(D_L D_S)) for 0.5 M☉ at 4 kpc with the source at 8 kpc:
    // 4 · 1476.625 m · 0.5 / 3.0857e16 m / 8000 = 1.1964e-17, sqrt → 3.4588e-9 rad = 0.7134 mas.
    await page.getByTestId("added-target").waitFor();
    await expect(page.getByTestId("added-target").textContent()).resolves.toContain("Einstein radius 0.7134 mas");
    // The optimistic "(saving…)" row shows no computed value; the server's row that replaces it does.
    const radiusCell = page
      .getByTestId("target-row")
      .filter({ hasText: "ASH-32-0001", hasNotText: "saving…" })
      .locator('[data-column="einsteinRadiusMas"]');
    await expect.poll(() => radiusCell.textContent(), { timeout: 10_000 }).toBe("0.7134");

    const invite = page.getByRole("form", { name: "Invite a colleague" });
    await invite.getByLabel("Invite by e-mail").fill(colleagueEmail);
    await invite.getByLabel("Role").selectOption("viewer");
    await invite.getByRole("button", { name: "Send invitation" }).click();
    await page.getByRole("list", { name: "Open invitations" }).getByText(colleagueEmail).waitFor();

    // The colleague, in a browser of their own, finds the invitation in the local mailbox.
    const colleague = await newPage(browser);
    const other = colleague.page;
    await other.goto("/dev/mailbox");
    const mail = other.getByTestId("mail").filter({ hasText: colleagueEmail });
    await expect(mail.getByRole("heading").textContent()).resolves.toContain("Microlensing toward the Ashgrove field");
    await mail.getByRole("link", { name: /\/proposals\/invitations\// }).click();
    await other.getByRole("heading", { name: /Join/ }).waitFor();
    await other.getByRole("link", { name: "create an account" }).click();
    await expect(other.getByLabel("E-mail").inputValue()).resolves.toBe(colleagueEmail);
    await signUp(other, "Jorun Tallis", "tallis-e2e-password");
    await other.getByRole("button", { name: "Accept the invitation" }).click();
    await other.waitForURL(proposalUrl);
    await expect(other.getByTestId("my-role").textContent()).resolves.toBe("Viewer");

    // A viewer sees the targets and their computed columns, and no edit controls anywhere.
    await other.getByTestId("target-row").filter({ hasText: "ASH-32-0001" }).waitFor();
    expect(await other.getByRole("form", { name: "Add a target" }).count()).toBe(0);
    expect(await other.getByRole("form", { name: "Invite a colleague" }).count()).toBe(0);
    expect(await other.getByRole("combobox", { name: /Role of/ }).count()).toBe(0);
    await other.getByRole("link", { name: "ASH-32-0001" }).click();
    await other.getByTestId("computed-einstein-radius").waitFor();
    await expect(other.getByTestId("computed-einstein-radius").textContent()).resolves.toBe("0.7134 mas");
    expect(await other.getByRole("combobox", { name: "Status" }).count()).toBe(0);
    expect(await other.getByRole("form", { name: "Add a note" }).count()).toBe(0);
    expect(await other.getByRole("button", { name: "Edit" }).count()).toBe(0);

    // The server refuses what the UI hides: the viewer's own session gets 403 from the API.
    const refused = await colleague.context.request.post(`${baseUrl}/api/proposals/${proposalId}/targets`, {
      data: { name: "sneaky", ra: "1 0 0", dec: "0 0 0", lensModel: "point", lensMassSolar: 1, lensDistancePc: 10, sourceDistancePc: 20, sourceOffsetThetaE: 1, priority: 1 },
    });
    expect(refused.status()).toBe(403);
    expect((await refused.json()).error.code).toBe("forbidden:target");
    const readable = await colleague.context.request.get(`${baseUrl}/api/proposals/${proposalId}/targets`);
    expect(readable.status()).toBe(200);

    // The PI's feed records the join.
    await page.reload();
    await page.getByTestId("activity-feed").getByText("Jorun Tallis as Viewer").waitFor();

    await colleague.context.close();
    await pi.context.close();
    expect(pi.consoleErrors.filter((e) => !e.includes("Failed to load resource"))).toEqual([]);
  });

  it("signs a seeded demo account in with its password and refuses a wrong one", async () => {
    const { page, context } = await newPage(browser);
    await page.goto("/sign-in");
    const form = page.getByRole("form", { name: "Sign in with password" });
    await form.getByLabel("E-mail").fill("tomas.brenneke@tessellate.example");
    await form.getByLabel("Password").fill("not-the-password");
    await form.getByRole("button", { name: "Sign in" }).click();
    await expect(form.getByRole("alert").textContent()).resolves.toBe("Wrong e-mail or password, or the account is waiting for its e-mailed confirmation.");
    await form.getByLabel("Password").fill("brenneke-demo-arcs");
    await form.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL("**/proposals");
    await page.getByRole("link", { name: "Bending starlight in the Cinder bulge window" }).waitFor();
    await context.close();
  });
});
