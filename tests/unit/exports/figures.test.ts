import { XMLParser, XMLValidator } from "fast-xml-parser";
import extractChunks from "png-chunks-extract";
import { decode as decodeText } from "png-chunk-text";
import { PDFParse } from "pdf-parse";
import { describe, expect, it } from "vitest";
import { demoSketch } from "@/lib/bench/sketch-state";
import { AppError } from "@/lib/errors";
import { benchPlotExport, BENCH_PLOT_HEIGHT_PX, BENCH_PLOT_WIDTH_PX } from "@/lib/exports/figures/bench-figures";
import { figureResponse } from "@/lib/exports/figures/figure-response";
import { figureFormatQuerySchema } from "@/lib/exports/figures/figure-format";
import { PNG_PROVENANCE_KEYWORD } from "@/lib/exports/png-text";
import packageJson from "@/package.json";

const exportedAt = new Date("2031-02-03T04:05:06.000Z");
const plot = benchPlotExport("deflection", { ...demoSketch, mass: "0.7 Msun" }, "http://arcwright.test", exportedAt);
const download = (format: string, extra: Record<string, string> = {}) => figureResponse(plot, figureFormatQuerySchema.parse({ format, ...extra }));

describe("bench figure export", () => {
  it("regenerates the plot from the bench parameters; the link back reproduces the sketch", () => {
    expect(plot.markup.startsWith("<svg")).toBe(true);
    expect(plot.markup).toContain("impact parameter b / M");
    const url = new URL(plot.provenance.reproduceUrl);
    expect(url.pathname).toBe("/bench");
    expect(url.searchParams.get("mass")).toBe("0.7 Msun");
    expect(plot.provenance.inputs.mass).toBe("0.7 Msun");
  });

  it("refuses a sketch that does not parse, naming the field", () => {
    try {
      benchPlotExport("lens-plane", { ...demoSketch, mass: "heavy" }, "http://arcwright.test");
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(AppError);
      expect((error as AppError).code).toBe("bad_request:figure");
      expect(Object.keys((error as AppError).fields ?? {})).toEqual(["mass"]);
    }
    expect(() => benchPlotExport("light-curve", { ...demoSketch, lens: "sis" }, "http://arcwright.test")).toThrow(/point\) lens/);
  });
});

describe("SVG: self-contained, font embedded, provenance in <metadata>", () => {
  it("is well-formed XML without DOCTYPE, sized in pixels, with Source Sans 3 as WOFF2 data and the provenance JSON", async () => {
    const response = await download("svg");
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="bench-deflection.svg"');
    const svg = await response.text();
    expect(/<!DOCTYPE/i.test(svg)).toBe(false);
    expect(XMLValidator.validate(svg)).toBe(true);
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" }).parse(svg);
    expect(doc.svg.width).toBe(String(BENCH_PLOT_WIDTH_PX));
    expect(doc.svg.height).toBe(String(BENCH_PLOT_HEIGHT_PX));
    expect(svg).toMatch(/@font-face\{font-family:"Source Sans 3";font-style:normal;font-weight:400;src:url\(data:font\/woff2;base64,d09GMg/);
    // No external references: every url() is a data: URI or an in-document #id.
    expect([...svg.matchAll(/url\(([^)]*)\)/g)].every(([, target]) => target.startsWith("data:") || target.startsWith("#"))).toBe(true);
    const provenance = JSON.parse(doc.svg.metadata["arcwright:provenance"]["#text"]);
    expect(provenance.version).toBe(packageJson.version);
    expect(provenance.exportedAt).toBe("2031-02-03T04:05:06.000Z");
    expect(provenance.constants.find((c: { name: string }) => c.name === "GM_sun").source).toContain("IAU 2015");
  });
});

describe("PNG: chosen width and DPI, provenance in text chunks", () => {
  it("is the requested width, records the DPI in pHYs and the provenance in tEXt and iTXt (read back with png-chunks-extract)", async () => {
    const response = await download("png", { width: "1080", dpi: "600" });
    const png = new Uint8Array(await response.arrayBuffer());
    const chunks = extractChunks(png);
    const header = Buffer.from(chunks[0].data);
    expect(chunks[0].name).toBe("IHDR");
    // IHDR width and height (PNG 3rd ed. §11.2.2): 1080 wide, height in proportion 540:340.
    expect(header.readUInt32BE(0)).toBe(1080);
    expect(header.readUInt32BE(4)).toBe(Math.round((1080 * BENCH_PLOT_HEIGHT_PX) / BENCH_PLOT_WIDTH_PX));
    const phys = Buffer.from(chunks.find((c) => c.name === "pHYs")!.data);
    // 600 DPI = 600 / 0.0254 m = 23622 pixels per metre (PNG 3rd ed. §11.3.5.3), unit 1 = metre.
    expect([phys.readUInt32BE(0), phys.readUInt32BE(4), phys[8]]).toEqual([23622, 23622, 1]);
    const texts = Object.fromEntries(chunks.filter((c) => c.name === "tEXt").map((c) => decodeText(c.data)).map((t) => [t.keyword, t.text]));
    expect(texts.Software).toBe(`Arcwright ${packageJson.version}`);
    expect(texts["Creation Time"]).toBe("2031-02-03T04:05:06.000Z");
    expect(texts.Source).toContain("/bench?");
    const itxt = Buffer.from(chunks.find((c) => c.name === "iTXt")!.data);
    const keywordEnd = itxt.indexOf(0);
    expect(itxt.subarray(0, keywordEnd).toString("latin1")).toBe(PNG_PROVENANCE_KEYWORD);
    const provenance = JSON.parse(itxt.subarray(keywordEnd + 5).toString("utf8"));
    expect(provenance.inputs.mass).toBe("0.7 Msun");
  });

  it("refuses a width or DPI outside the bounds, naming the field", () => {
    expect(figureFormatQuerySchema.safeParse({ format: "png", width: "50" }).error?.issues[0].path).toEqual(["width"]);
    expect(figureFormatQuerySchema.safeParse({ format: "png", dpi: "5000" }).error?.issues[0].path).toEqual(["dpi"]);
  });
});

describe("PDF: vector figure, embedded font, provenance in the info dictionary (read with pdf-parse)", () => {
  it("opens, holds the caption text and the provenance keys, and embeds Source Sans 3", async () => {
    const response = await download("pdf");
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect(Buffer.from(bytes.subarray(0, 5)).toString("latin1")).toBe("%PDF-");
    const raw = Buffer.from(bytes).toString("latin1");
    // pdf.js takes over the buffer it is given: hand it a copy.
    const parser = new PDFParse({ data: bytes.slice() });
    const text = await parser.getText();
    expect(text.text).toContain("Deflection angle against impact parameter");
    // The whole link, wrapped onto as many caption lines as it takes (it was cut off at the band's edge).
    expect(text.text).toContain("Reproduce:");
    expect(text.text.replace(/\s+/g, "")).toContain(plot.provenance.reproduceUrl);
    const info = await parser.getInfo();
    // No exporter named (the open bench signed out): no Author; the software is the Creator.
    expect(info.info.Author).toBeUndefined();
    expect(info.info.Creator).toBe(`Arcwright ${packageJson.version}`);
    // pdf.js lists keys outside ISO 32000-1 Table 317 under `Custom`.
    expect(JSON.parse(info.info.Custom.ArcwrightProvenance).inputs.mass).toBe("0.7 Msun");
    await parser.destroy();
    // The font program is embedded (a FontFile2/3 stream) under a subset name of Source Sans 3.
    expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+SourceSans3/);
  });
});
