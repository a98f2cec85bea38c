import extractChunks from "png-chunks-extract";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { proposals } from "@/db/schema";
import type { Actor } from "@/lib/server/actor";
import { skyFigureRoutes } from "@/lib/server/api/figure-routes";
import { createWorld } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

function nightSky(actor: Actor | null, proposalId: string, query: string) {
  const url = `http://arcwright.test/api/proposals/${proposalId}/exports/figures/night-sky?${query}`;
  return skyFigureRoutes(async () => actor).GET(new Request(url), { params: Promise.resolve({ proposalId, figure: "night-sky" }) });
}

describe("sky brightness figure export: the same role rules as the night chart", () => {
  it("signed out 401, non-member 404; a viewer gets the SVG in the proposal's band (no telescope aperture set: the sky needs none) with the night and band in its provenance, and a PNG at the chosen width", async () => {
    const world = await createWorld();
    const query = `targetId=${world.targetId}&date=2031-06-15&format=svg`;
    expect((await nightSky(null, world.proposalId, query)).status).toBe(401);
    expect((await nightSky(world.actors.outsider, world.proposalId, query)).status).toBe(404);
    const response = await nightSky(world.actors.viewer, world.proposalId, query);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="sky-tb-ml-0001-2031-06-15.svg"');
    const svg = await response.text();
    // A new proposal observes in I (Johnson–Cousins) under the typical dark site (photometry-schema.ts defaults).
    expect(svg).toContain("Sky at TB-ML-0001 from Cerro Velado test site in I (Johnson–Cousins), night of 2031-06-15");
    expect(svg).toContain("dark sky (no Moon)");
    expect(svg).toContain("&quot;band&quot;:&quot;I (Johnson–Cousins)&quot;");
    const reproduce = /&quot;reproduceUrl&quot;:&quot;([^&]+(?:&amp;[^&]+)*)&quot;/.exec(svg)?.[1].replace(/&amp;/g, "&");
    const url = new URL(reproduce!);
    expect(url.pathname).toBe(`/proposals/${world.proposalId}/targets/${world.targetId}`);
    expect(url.searchParams.get("night")).toBe("2031-06-15");

    const png = await nightSky(world.actors.coi, world.proposalId, `targetId=${world.targetId}&date=2031-06-15&format=png&width=900&dpi=150`);
    expect(png.status).toBe(200);
    expect(Buffer.from(extractChunks(new Uint8Array(await png.arrayBuffer()))[0].data).readUInt32BE(0)).toBe(900);
  });

  it("says in words why it cannot draw a band the settings do not describe, and names a bad night", async () => {
    const world = await createWorld();
    const customBand = { label: "Hα narrow", effectiveWavelengthNm: 656.3, widthNm: 3, zeroPointWPerM2PerNm: 1.8e-11, zeroPointSystem: "vega", abMinusVegaMag: null };
    await dbClient().db.update(proposals).set({ photometry: { bandId: "custom", customBand } }).where(eq(proposals.id, world.proposalId));
    const missing = await nightSky(world.actors.viewer, world.proposalId, `targetId=${world.targetId}&date=2031-06-15&format=svg`);
    expect(missing.status).toBe(400);
    expect((await missing.json()).error.message).toBe("Set the site's dark sky and extinction in Hα narrow in the photometry settings.");
    const bad = await nightSky(world.actors.viewer, world.proposalId, `targetId=${world.targetId}&date=2031-02-30`);
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).error.fields)).toEqual(["date"]);
  });
});
