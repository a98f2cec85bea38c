import type { APIRequestContext, Browser, BrowserContext, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoAccounts } from "@/db/seed/demo-scenario";
import { baseUrl, launchBrowser, newPage } from "./support/browser";
import { signInAsDemo } from "./support/demo";
import { HOSTILE_HOST, XSS_MARKER, fitsTargetName, sqlLookingInputs, xssCorpus } from "./support/xss-corpus";

/**
 * Hostile text in every field that pages show (OWASP XSS Prevention Cheat Sheet: output encoding for
 * the HTML body and attribute contexts, URL scheme allow-listing). The browser runs with the
 * Content-Security-Policy bypassed, so a pass proves the markup itself is safe, not that the policy
 * caught what it let through.
 */

let browser: Browser;
/** Target pages loaded at once by the payload-name test (the server renders them side by side). */
const TARGET_PAGE_TABS = 3;
const run = Date.now().toString(36);

/** Everything hostile the page did: marker calls, dialogs, requests and navigations off the site, dangerous markup. */
interface Watch {
  calls: number[];
  dialogs: string[];
  strayRequests: string[];
  strayNavigations: string[];
}

declare global {
  interface Window {
    __auditMarkup: (root: ParentNode) => string[];
    __markupSeen: string[];
  }
}

/**
 * In every document and frame, before any of its own scripts: `__auditMarkup` lists elements and
 * attributes that can run script, load a document or leave the site (the OWASP cheat sheet's vectors:
 * script, frames, object/embed, base, meta refresh, on* handlers, javascript:/vbscript:/data: URLs in
 * URL attributes, srcdoc, CSS expressions and imports, SVG animation of href); a mutation observer
 * runs it on every node added, so markup that appears and goes again is caught too.
 */
function installMarkupAudit() {
  const urlAttributes = new Set(["href", "src", "action", "formaction", "xlink:href", "data", "poster", "background", "lowsrc", "ping", "codebase", "cite"]);
  const frameworkScript = (script: HTMLScriptElement) => {
    // An empty inline script runs nothing (the router writes some while navigating).
    if (!script.src && script.text.trim() === "") return true;
    if (script.src) {
      const url = new URL(script.src, location.href);
      return url.origin === location.origin && url.pathname.startsWith("/_next/");
    }
    // Inline scripts the framework writes: the bundler's chunk list, the flight data, React's Suspense reveals.
    return !script.closest("main") && /^\s*(\(globalThis\["TURBOPACK"\]|\(?self\.__next_f|\$R[A-Z]|requestAnimationFrame\(function\(\)\{\$RT)/.test(script.text);
  };
  const outline = (el: Element) => `<${el.localName}${[...el.attributes].map((a) => ` ${a.name}="${a.value.slice(0, 60)}"`).join("")}>`;
  window.__auditMarkup = (root: ParentNode) => {
    const found: string[] = [];
    const elements = root instanceof Element ? [root, ...root.querySelectorAll("*")] : [...root.querySelectorAll("*")];
    for (const el of elements) {
      const tag = el.localName;
      if (["iframe", "frame", "frameset", "object", "embed", "applet", "base", "portal"].includes(tag)) found.push(outline(el));
      if (tag === "meta" && el.hasAttribute("http-equiv")) found.push(outline(el));
      if (tag === "script" && !frameworkScript(el as HTMLScriptElement)) found.push(`${outline(el)}${(el.textContent ?? "").slice(0, 80)}`);
      if (tag === "style" && /@import|expression\s*\(|javascript:|xss\.invalid/i.test(el.textContent ?? "")) found.push(`${outline(el)}${el.textContent?.slice(0, 80)}`);
      if ((tag === "animate" || tag === "set") && /href/i.test(el.getAttribute("attributeName") ?? "")) found.push(outline(el));
      for (const attribute of el.attributes) {
        const name = attribute.name.toLowerCase();
        // Browsers ignore ASCII whitespace and control characters inside a scheme (WHATWG URL).
        const value = attribute.value.replace(/[\u0000-\u0020]/g, "").toLowerCase();
        const isDangerous =
          name.startsWith("on") ||
          name === "srcdoc" ||
          (urlAttributes.has(name) && (/^(javascript|vbscript):/.test(value) || /^data:(text\/html|image\/svg|application)/.test(value) || value.includes("xss.invalid"))) ||
          (name === "style" && /expression\(|javascript:|xss\.invalid/.test(value));
        if (isDangerous) found.push(outline(el));
      }
    }
    return found;
  };
  window.__markupSeen = [];
  new MutationObserver((records) => {
    for (const record of records) {
      if (record.type === "attributes" && record.target instanceof Element) window.__markupSeen.push(...window.__auditMarkup(record.target));
      for (const node of record.addedNodes) if (node instanceof Element) window.__markupSeen.push(...window.__auditMarkup(node));
    }
  }).observe(document, { childList: true, subtree: true, attributes: true });
}

/** Records on `page` every trace of executed content: marker calls, dialogs and navigations off the site. */
async function watchPage(page: Page): Promise<Watch> {
  const watch: Watch = { calls: [], dialogs: [], strayRequests: [], strayNavigations: [] };
  // Exposed in every frame, so a payload that ran inside a frame reports too.
  await page.exposeFunction(XSS_MARKER, (id: number) => watch.calls.push(id));
  await page.addInitScript(installMarkupAudit);
  page.on("dialog", (dialog) => {
    watch.dialogs.push(`${dialog.type()}: ${dialog.message()}`);
    void dialog.dismiss();
  });
  page.on("request", (request) => {
    if (new URL(request.url()).hostname.endsWith(HOSTILE_HOST)) watch.strayRequests.push(`${request.resourceType()} ${request.url()}`);
  });
  page.on("framenavigated", (frame) => {
    if (frame === page.mainFrame() && !frame.url().startsWith(baseUrl)) watch.strayNavigations.push(frame.url());
  });
  page.on("popup", (popup) => watch.strayNavigations.push(`popup ${popup.url()}`));
  return watch;
}

/** A fresh page (own cookies) with CSP bypassed and every trace of executed content recorded. */
async function watchedPage(): Promise<{ context: BrowserContext; page: Page; watch: Watch }> {
  const { context, page } = await newPage(browser, { bypassCSP: true });
  return { context, page, watch: await watchPage(page) };
}

/** Fails with the evidence if anything hostile happened on the page so far. */
async function expectNothingRan(page: Page, watch: Watch, where: string) {
  const markup = await page.evaluate(() => [...window.__markupSeen, ...window.__auditMarkup(document)]);
  expect({ where, ...watch, markup: [...new Set(markup)] }).toEqual({ where, calls: [], dialogs: [], strayRequests: [], strayNavigations: [], markup: [] });
}

/** The text a person reads in the element: its text nodes, leaving out script, style and template. */
function readableText(locator: Locator): Promise<string> {
  return locator.evaluate((root) => {
    const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT, {
      acceptNode: (node) => (node.parentElement?.closest("script, style, template") ? NodeFilter.FILTER_REJECT : NodeFilter.FILTER_ACCEPT),
    });
    let text = "";
    while (walker.nextNode()) text += walker.currentNode.nodeValue;
    return text;
  });
}

/**
 * The text of `cells` on each page of a paged list, pressing `next` until it is disabled; a page
 * counts once its first cell differs from the previous page's (the old rows stay while the next load).
 */
async function namesOfEveryPage(next: Locator, cells: Locator, maxPages = 10): Promise<string[]> {
  const names: string[] = [];
  for (let pageIndex = 0; pageIndex < maxPages; pageIndex++) {
    await cells.first().waitFor();
    const shown = await cells.evaluateAll((elements) => elements.map((e) => e.textContent ?? ""));
    names.push(...shown);
    if (await next.isDisabled()) return names;
    await next.click();
    await expect.poll(() => cells.first().textContent()).not.toBe(shown[0]);
  }
  throw new Error(`More than ${maxPages} pages`);
}

const hostileTitle = `<img src=x onerror=${XSS_MARKER}(901)> Hostile text ${run} '); DROP TABLE proposals; --`;
const hostileCycle = `"><svg onload=${XSS_MARKER}(902)>`;
const hostileSiteName = `<script>${XSS_MARKER}(903)</script> 1' OR '1'='1`;
const hostileAbstract = xssCorpus.map((p) => p.source).join("\n");
/** Every target name: the payloads that fit in a name, then the SQL-looking strings. */
const targetNames = [...xssCorpus.map((p) => p.source).filter(fitsTargetName), ...sqlLookingInputs];
/** The target that carries the notes; its name is the first SQL-looking string. */
const noteHostName = sqlLookingInputs[0];
const sqlNoteBody = sqlLookingInputs.join("\n\n");
const historyNoteEdit = `Edited: <img src=x onerror=${XSS_MARKER}(904)>`;
const mergeNoteBody = `Merge case ${run} <svg onload=${XSS_MARKER}(905)>`;

let pi: { context: BrowserContext; page: Page; watch: Watch };
let api: APIRequestContext;
let proposalId = "";
const targetIds = new Map<string, string>();

/** Sends JSON with the PI's cookies and fails the test on any answer but a success. */
async function sendJson(path: string, data: unknown, method: "post" | "patch" = "post"): Promise<Record<string, { id: string }>> {
  const answer = await api[method](`${baseUrl}${path}`, { data });
  expect(answer.status(), `${method} ${path}: ${await answer.text()}`).toBeLessThan(300);
  return answer.json();
}

beforeAll(async () => {
  browser = await launchBrowser();
  pi = await watchedPage();
  api = pi.context.request;
  await signInAsDemo(pi.page, "pi");
  const { proposal } = await sendJson("/api/proposals", {
    title: hostileTitle,
    cycle: hostileCycle,
    abstract: hostileAbstract,
    // A short cycle keeps the season view quick.
    cycleStartDate: "2033-06-01",
    cycleEndDate: "2033-06-14",
    site: { name: hostileSiteName, latitudeDeg: -31.27, longitudeDeg: -68.93, elevationM: 2480, horizonLimitDeg: 20 },
    instrument: { resolutionMas: 50, cadenceHours: 12, campaignLengthDays: 90 },
  });
  proposalId = proposal.id;
  for (const [index, name] of targetNames.entries()) {
    const { target } = await sendJson(`/api/proposals/${proposalId}/targets`, {
      name,
      ra: `17 ${String(50 + (index % 10)).padStart(2, "0")} 00`,
      dec: "-29 30 00",
      lensModel: "point",
      lensMassSolar: 0.5,
      lensDistancePc: 4000,
      sourceDistancePc: 8000,
      sourceOffsetThetaE: 0.3,
      priority: 3,
    });
    targetIds.set(name, target.id);
  }
  const notesPath = `/api/proposals/${proposalId}/targets/${targetIds.get(noteHostName)}/notes`;
  for (const payload of xssCorpus) await sendJson(notesPath, { body: payload.source });
  const sqlNoteId = (await sendJson(notesPath, { body: sqlNoteBody })).note.id;
  // A second version, so the note's history shows the first one.
  await sendJson(`${notesPath}/${sqlNoteId}`, { body: `${sqlNoteBody}\n\n${historyNoteEdit}`, version: 1 }, "patch");
  await sendJson(notesPath, { body: mergeNoteBody });
}, 120_000);

afterAll(async () => {
  if (proposalId) {
    const deleted = await api.delete(`${baseUrl}/api/proposals/${proposalId}`);
    expect(deleted.status()).toBe(204);
  }
  await pi?.context.close();
  await browser?.close();
});

describe("hostile notes, names and titles never run and show as typed", () => {
  it("stores every name exactly as sent (the API answers with the same text), and refuses a NUL by field", async () => {
    const answer = await api.get(`${baseUrl}/api/proposals/${proposalId}/targets?pageSize=100`);
    const { rows } = (await answer.json()) as { rows: { name: string }[] };
    expect(rows.map((r) => r.name).sort()).toEqual([...targetNames].sort());
    // The one character PostgreSQL text cannot hold is refused by field, not failed on insert (a 500).
    const notesPath = `${baseUrl}/api/proposals/${proposalId}/targets/${targetIds.get(noteHostName)}/notes`;
    const refused = await api.post(notesPath, { data: { body: "before\u0000after" } });
    expect(refused.status()).toBe(400);
    expect((await refused.json()).error.fields.body).toEqual(["The note cannot contain the NUL character (U+0000)."]);
  });

  it("the proposals list shows the title as text", async () => {
    const { page, watch } = pi;
    await page.goto("/proposals");
    const link = page.getByRole("link", { name: hostileTitle, exact: true });
    await link.waitFor();
    expect(await readableText(link)).toBe(hostileTitle);
    await expectNothingRan(page, watch, "/proposals");
  });

  it("the proposal page: header, every target in the table, and the whole activity feed", async () => {
    const { page, watch } = pi;
    await page.goto(`/proposals/${proposalId}`);
    expect(await readableText(page.getByRole("heading", { level: 1 }))).toBe(hostileTitle);
    const header = await readableText(page.locator("main header"));
    for (const text of [hostileCycle, hostileSiteName, hostileAbstract]) expect(header).toContain(text);

    // Names from every page of the table (50 rows a page).
    const nameLinks = page.getByTestId("target-row").locator('[data-column="name"] a');
    const names = await namesOfEveryPage(page.getByRole("navigation", { name: "Target pages" }).getByRole("button", { name: "Next" }), nameLinks);
    expect(names.sort()).toEqual([...targetNames].sort());

    const feed = page.getByTestId("activity-feed");
    await feed.getByRole("listitem").first().waitFor();
    const older = page.getByRole("button", { name: "Older activity" });
    while (await older.count()) {
      const shown = await feed.getByRole("listitem").count();
      await older.click();
      await expect.poll(() => feed.getByRole("listitem").count()).toBeGreaterThan(shown);
    }
    const entries = await feed.getByRole("listitem").evaluateAll((items) => items.map((li) => li.textContent ?? ""));
    for (const name of targetNames) expect(entries.some((entry) => entry.includes(`added ${name}`)), name).toBe(true);
    expect(entries.filter((entry) => entry.includes(`wrote a note on ${noteHostName}`))).toHaveLength(xssCorpus.length + 2);
    await expectNothingRan(page, watch, "proposal page");
  });

  it("the target page: its name, every note, the history and the merge view", async () => {
    const { page, watch } = pi;
    await page.goto(`/proposals/${proposalId}/targets/${targetIds.get(noteHostName)}`);
    expect(await readableText(page.getByRole("heading", { level: 1 }))).toBe(noteHostName);
    await expect.poll(() => page.getByTestId("note").count()).toBe(xssCorpus.length + 2);

    // SQL-looking lines come through Markdown as the same text.
    const sqlNote = page.getByTestId("note").filter({ hasText: sqlLookingInputs[1] });
    const sqlText = await readableText(sqlNote);
    for (const text of sqlLookingInputs) expect(sqlText).toContain(text);
    // The history shows the first version's source exactly.
    await sqlNote.getByRole("button", { name: "History" }).click();
    const earlier = sqlNote.getByRole("list", { name: "Earlier versions" }).locator("pre");
    await earlier.first().waitFor();
    expect(await earlier.allTextContents()).toContain(sqlNoteBody);

    // Merge: the note changes on the server while it is open here; both texts are shown as typed.
    const mergeNote = page.getByTestId("note").filter({ hasText: `Merge case ${run}` });
    await mergeNote.getByRole("button", { name: "Edit" }).click();
    const notes = (await (await api.get(`${baseUrl}/api/proposals/${proposalId}/targets/${targetIds.get(noteHostName)}/notes`)).json()) as { notes: { id: string; body: string }[] };
    const mergeId = notes.notes.find((n) => n.body === mergeNoteBody)!.id;
    const theirs = `${mergeNoteBody}\n${xssCorpus[4].source}`;
    await sendJson(`/api/proposals/${proposalId}/targets/${targetIds.get(noteHostName)}/notes/${mergeId}`, { body: theirs, version: 1 }, "patch");
    const mine = `${mergeNoteBody}\n${xssCorpus[1].source}`;
    const edit = page.getByRole("form", { name: "Edit note" });
    await edit.getByLabel("Note text (Markdown)").fill(mine);
    await edit.getByRole("button", { name: "Save note" }).click();
    const conflict = page.getByTestId("note-conflict");
    await conflict.waitFor();
    expect(await conflict.locator("pre").allTextContents()).toEqual([theirs, mine]);

    // The delete confirmation names the target as typed.
    await page.getByRole("button", { name: "Delete target" }).click();
    expect(await readableText(page.getByRole("alertdialog", { name: "Delete target" }))).toContain(`${noteHostName} and all its observation notes`);
    await page.getByRole("button", { name: "Keep it" }).click();
    await expectNothingRan(page, watch, "target page");
  });

  it("every payload-named target page shows its name as the heading", async () => {
    // The pages load in TARGET_PAGE_TABS tabs of the PI's session at once, each tab watched on its own;
    // each page is audited for hostile markup before its tab loads the next one.
    const tabs = [pi, ...(await Promise.all(Array.from({ length: TARGET_PAGE_TABS - 1 }, async () => {
      const page = await pi.context.newPage();
      return { page, watch: await watchPage(page) };
    })))];
    await Promise.all(
      tabs.map(async ({ page, watch }, tab) => {
        for (const name of targetNames.filter((_, index) => index % TARGET_PAGE_TABS === tab)) {
          await page.goto(`/proposals/${proposalId}/targets/${targetIds.get(name)}`);
          expect(await readableText(page.getByRole("heading", { level: 1 })), name).toBe(name);
          await expectNothingRan(page, watch, `target page of ${name}`);
        }
      }),
    );
    for (const { page } of tabs.slice(1)) await page.close();
  }, 240_000);

  it("the season view names every target as typed", async () => {
    const { page, watch } = pi;
    await page.goto(`/proposals/${proposalId}/sky`);
    const table = page.getByTestId("season-table");
    await table.waitFor({ timeout: 60_000 });
    // 25 targets a page.
    const rowNames = await namesOfEveryPage(page.getByRole("button", { name: "Next targets" }), table.locator('tbody th[scope="row"]'));
    expect(rowNames.sort()).toEqual([...targetNames].sort());
    expect(await readableText(page.locator("main"))).toContain(hostileSiteName);
    await expectNothingRan(page, watch, "season view");
  });

  it("the technical summary (print page) names every target and the proposal as typed", async () => {
    const { page, watch } = pi;
    await page.goto(`/proposals/${proposalId}/summary`);
    expect(await readableText(page.getByRole("heading", { level: 1 }))).toBe(`Technical summary: ${hostileTitle}`);
    const text = await readableText(page.getByTestId("summary-table"));
    for (const name of targetNames) expect(text, name).toContain(name);
    await page.emulateMedia({ media: "print" });
    await expectNothingRan(page, watch, "technical summary");
    await page.emulateMedia({ media: "screen" });
  });

  it("the settings form holds the title, cycle, abstract and site name as typed", async () => {
    const { page, watch } = pi;
    await page.goto(`/proposals/${proposalId}/settings`);
    await expect(page.getByLabel("Title", { exact: true }).inputValue()).resolves.toBe(hostileTitle);
    await expect(page.getByLabel("Observing cycle", { exact: true }).inputValue()).resolves.toBe(hostileCycle);
    await expect(page.getByLabel("Site name", { exact: true }).inputValue()).resolves.toBe(hostileSiteName);
    await expect(page.getByRole("textbox", { name: /^Abstract/ }).inputValue()).resolves.toBe(hostileAbstract);
    await expectNothingRan(page, watch, "settings");
  });
});

describe("a hostile proposal title in an invitation", () => {
  it("the mail and the invitation page show it as text to someone signed out", async () => {
    const email = `invitee-${run}@example.org`;
    await sendJson(`/api/proposals/${proposalId}/invitations`, { email, role: "viewer" });
    const { context, page, watch } = await watchedPage();
    await page.goto("/dev/mailbox");
    const mail = page.getByTestId("mail").filter({ hasText: email });
    expect(await readableText(mail.getByRole("heading"))).toContain(hostileTitle);
    await mail.getByRole("link", { name: /\/proposals\/invitations\// }).click();
    await page.waitForURL("**/proposals/invitations/*");
    expect(await readableText(page.getByRole("heading", { level: 1 }))).toBe(`Join “${hostileTitle}”`);
    await expectNothingRan(page, watch, "mailbox and invitation");
    await context.close();
  });
});

describe("hostile text in addresses never runs", () => {
  it("the public sky page holds a site name from its address as typed", async () => {
    const { context, page, watch } = await watchedPage();
    const site = xssCorpus[1].source;
    const query = new URLSearchParams({ site, lat: "-30", lon: "-70", ra: "17h56m00s", dec: "-29d30m00s", date: "2033-06-01", nights: "7" });
    await page.goto(`/sky?${query}`);
    await page.getByTestId("night-chart").waitFor();
    await expect(page.getByLabel("Site name").inputValue()).resolves.toBe(site);
    await expectNothingRan(page, watch, "/sky");
    await context.close();
  });

  it("the lens bench shows typed values from its address as text", async () => {
    const { context, page, watch } = await watchedPage();
    const typed = xssCorpus[6].source;
    await page.goto(`/bench?mass=${encodeURIComponent(typed)}`);
    await expect(page.getByLabel("Lens mass").inputValue()).resolves.toBe(typed);
    await expectNothingRan(page, watch, "/bench");
    await context.close();
  });

  it("signing in never follows a callback off the site (OWASP Unvalidated Redirects Cheat Sheet)", async () => {
    // The demo viewer signs in here: each account has 8 sign-ins per 15 minutes, and the PI's go to other tests.
    // More shapes are in tests/unit/auth/callback-path.test.ts.
    const viewer = demoAccounts.find((account) => account.key === "viewer")!;
    for (const callbackUrl of [`/\\${HOSTILE_HOST}/`, `/\t/${HOSTILE_HOST}/`, `//${HOSTILE_HOST}/`]) {
      const { context, page, watch } = await watchedPage();
      await page.goto(`/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}`);
      const form = page.getByRole("form", { name: "Sign in with password" });
      await form.getByLabel("E-mail").fill(viewer.email);
      await form.getByLabel("Password").fill(viewer.password);
      await form.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
      await page.waitForLoadState();
      expect(new URL(page.url()).origin, callbackUrl).toBe(new URL(baseUrl).origin);
      await expectNothingRan(page, watch, `sign-in callback ${callbackUrl}`);
      await context.close();
    }
  });
});
