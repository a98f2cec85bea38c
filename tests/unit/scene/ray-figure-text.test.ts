import { describe, expect, it } from "vitest";
import { bundleMassSolar, CAPTION_KEYWORD, captionChunk, figureDpi, rayFigureCaption } from "@/components/scene/ray-figure-text";
import { physicalLengthText, scaleBarLengthM } from "@/lib/ray-view/scale";
import { physicalSizeChunk } from "@/lib/exports/png-text";
import { PRODUCT_VERSION } from "@/lib/exports/provenance";
import { demoSketch } from "@/lib/bench/sketch-state";

describe("the 3D view's saved figure: DPI, scale bar and caption", () => {
  it("prints at its size on screen: 96 DPI per export scale (CSS: 1px = 1/96 in), written as pixels per metre in pHYs", () => {
    expect([1, 2, 4].map((scale) => figureDpi(scale as 1 | 2 | 4))).toEqual([96, 192, 384]);
    // PNG 3rd ed. §11.3.5.3: two 4-byte big-endian pixels-per-unit, then unit 1 = metre.
    // 96 / 0.0254 = 3779.53 → 3780; 384 / 0.0254 = 15118.11 → 15118.
    const chunk = physicalSizeChunk(96);
    expect(chunk.name).toBe("pHYs");
    expect(Array.from(chunk.data)).toEqual([0, 0, 0x0e, 0xc4, 0, 0, 0x0e, 0xc4, 1]);
    const view = new DataView(physicalSizeChunk(384).data.buffer);
    expect([view.getUint32(0), view.getUint32(4)]).toEqual([15118, 15118]);
    // 2×: 192 / 0.0254 = 7559.06 → 7559 = 0x1d87, unit byte 1.
    expect(Array.from(physicalSizeChunk(figureDpi(2)).data)).toEqual([0, 0, 0x1d, 0x87, 0, 0, 0x1d, 0x87, 1]);
  });

  it("stores the caption as UTF-8 in an iTXt Description chunk (PNG 3rd ed. §11.3.4.5)", () => {
    const chunk = captionChunk("M☉ = 1");
    expect(chunk.name).toBe("iTXt");
    const head = `${CAPTION_KEYWORD}\0\0\0\0\0`;
    expect(Buffer.from(chunk.data.subarray(0, head.length)).toString("latin1")).toBe(head);
    expect(Buffer.from(chunk.data.subarray(head.length)).toString("utf8")).toBe("M☉ = 1");
  });

  it("picks the longest 1, 2 or 5 × 10ⁿ M bar that fits", () => {
    expect(scaleBarLengthM(10, 300)).toBe(20);
    expect(scaleBarLengthM(10, 500)).toBe(50);
    expect(scaleBarLengthM(3.7, 300)).toBe(50);
    expect(scaleBarLengthM(40, 300)).toBe(5);
    expect(scaleBarLengthM(400, 300)).toBe(0.5);
  });

  it("gives the bar's length for the mass: GM☉/c² = 1.3271244e20 m³ s⁻² / c² = 1476.625 m (IAU 2015 B3 nominal GM☉)", () => {
    expect(physicalLengthText(1, 1)).toBe("1.477 km");
    expect(physicalLengthText(50, 1e-3)).toBe("73.83 m");
    // Sgr A*-like 4.1e6 M☉, 10 M: 6.054e10 m / 149597870700 m per au (IAU 2012 B2) = 0.4047 au.
    expect(physicalLengthText(10, 4.1e6)).toBe("0.4047 au");
  });

  it("reads the mass only for a point lens whose mass field reads", () => {
    expect(bundleMassSolar({ lens: "point", mass: "4.1e6" })).toBe(4.1e6);
    expect(bundleMassSolar({ lens: "point", mass: "not a mass" })).toBeUndefined();
    expect(bundleMassSolar({ lens: "sis", mass: demoSketch.mass })).toBeUndefined();
  });

  it("captions mass, impact-parameter range, ray count, shape, product and version", () => {
    expect(rayFigureCaption({ massSolar: 10, bMinM: 0.5, bMaxM: 15, rayCount: 2000, layout: "fan" })).toBe(
      `Exact light paths past a Schwarzschild mass of 10 M☉ (lengths in units of M = GM/c² = 14.77 km): 2000 rays in a planar fan, impact parameters b = 0.5 to 15 M. Arcwright ${PRODUCT_VERSION}.`,
    );
    expect(rayFigureCaption({ massSolar: undefined, bMinM: 1, bMaxM: 100, rayCount: 12, layout: "cylinder" })).toBe(
      `Exact light paths past a Schwarzschild mass M (lengths in units of M = GM/c²): 12 rays in a full cylinder, impact parameters b = 1 to 100 M. Arcwright ${PRODUCT_VERSION}.`,
    );
  });
});
