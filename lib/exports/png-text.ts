/**
 * Provenance written into a PNG's text chunks, for figures rendered on the server and for the 3D
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
function internationalText(keyword: string, text: string): PngChunk {
  const head = Uint8Array.from(`${keyword}\0\0\0\0\0`, (character) => character.charCodeAt(0));
  const body = new TextEncoder().encode(text);
  const data = new Uint8Array(head.length + body.length);
  data.set(head);
  data.set(body, head.length);
  return { name: "iTXt", data };
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
    internationalText(PNG_PROVENANCE_KEYWORD, JSON.stringify(provenance)),
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
