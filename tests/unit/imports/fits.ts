import { FITS_BLOCK_BYTES } from "@/lib/imports/fits-header";

/** A FITS file from header cards (each padded to 80 columns, END added) and `dataBytes` of zeros. */
export function fitsFile(cards: string[], dataBytes = 0): Uint8Array<ArrayBuffer> {
  const header = [...cards, "END"].map((card) => card.padEnd(80, " ")).join("");
  const headerBytes = Math.ceil(header.length / FITS_BLOCK_BYTES) * FITS_BLOCK_BYTES;
  const dataBlocks = Math.ceil(dataBytes / FITS_BLOCK_BYTES) * FITS_BLOCK_BYTES;
  const bytes = new Uint8Array(headerBytes + dataBlocks);
  bytes.fill(0x20, 0, headerBytes);
  for (let i = 0; i < header.length; i += 1) bytes[i] = header.charCodeAt(i);
  return bytes;
}

/** A value card in fixed format: keyword in columns 1–8, "= " in 9–10, value right-aligned to column 30. */
export function card(key: string, value: string, comment?: string): string {
  return `${key.padEnd(8)}= ${value.padStart(20)}${comment === undefined ? "" : ` / ${comment}`}`;
}
