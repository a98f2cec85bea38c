/**
 * Provenance, DPI and captions written into a PNG's chunks, for figures rendered on the server and for the 3D
 * view saved in the browser alike (Uint8Array and TextEncoder only, no Node Buffer).
 */
import extractChunks from "png-chunks-extract";
import encodeChunks from "png-chunks-encode";
import { encode as encodeText } from "png-chunk-text";
import { provenanceLines, type Provenance } from "@/lib/exports/provenance";

/** Keyword of the iTXt chunk that holds the provenance as JSON (PNG 3rd ed. §11.3.3.4: 1–79 Latin-1 bytes). */
export const PNG_PROVENANCE_KEYWORD = "arcwright:provenance";

export interface PngChunk {
  name: string;
  data: Uint8Array;
}

/** An iTXt chunk, uncompressed, no language tag (PNG 3rd ed. §11.3.3.4), for UTF-8 text. */
export function internationalTextChunk(keyword: string, text: string): PngChunk {
  const head = Uint8Array.from(`${keyword}\0\0\0\0\0`, (character) => character.charCodeAt(0));
  const body = new TextEncoder().encode(text);
  const data = new Uint8Array(head.length + body.length);
  data.set(head);
  data.set(body, head.length);
  return { name: "iTXt", data };
}

const METRES_PER_INCH = 0.0254;

/** pHYs: pixels per metre on both axes, unit metre (PNG 3rd ed. §11.3.5.3), so the DPI travels with the file. */
export function physicalSizeChunk(dpi: number): PngChunk {
  const data = new Uint8Array(9);
  const view = new DataView(data.buffer);
  const pixelsPerMetre = Math.round(dpi / METRES_PER_INCH);
  view.setUint32(0, pixelsPerMetre);
  view.setUint32(4, pixelsPerMetre);
  data[8] = 1;
  return { name: "pHYs", data };
}

/** Latin-1 only, as tEXt requires: other characters become "?" (the iTXt copy keeps them). */
const latin1 = (text: string) => text.replace(/[^\x20-\x7E\xA0-\xFF\n]/g, "?");

/**
 * The provenance chunks: tEXt Title, Software, Creation Time, Source and Comment (keywords from PNG
 * 3rd ed. §11.3.4.2) and one iTXt chunk with the whole record as JSON.
 */
export function provenanceChunks(title: string, provenance: Provenance): PngChunk[] {
  return [
    encodeText("Title", latin1(title)),
    encodeText("Software", `${provenance.product} ${provenance.version}`),
    encodeText("Creation Time", provenance.exportedAt),
    encodeText("Source", provenance.reproduceUrl),
    encodeText("Comment", latin1(provenanceLines(provenance).join("\n"))),
    internationalTextChunk(PNG_PROVENANCE_KEYWORD, JSON.stringify(provenance)),
  ];
}

/**
 * The PNG with `extra` chunks inserted right after IHDR (text chunks may stand anywhere between IHDR
 * and IEND, PNG 3rd ed. §5.6); chunks of the names in `replacing` are dropped from the original.
 */
export function withPngChunks(png: Uint8Array, extra: PngChunk[], replacing: string[] = []): Uint8Array {
  const chunks = extractChunks(png).filter((chunk) => !replacing.includes(chunk.name));
  return encodeChunks([chunks[0], ...extra, ...chunks.slice(1)]);
}
