/// <reference types="pdfkit" />
// Type declarations for the export packages that ship none.

declare module "woff2sfnt-sfnt2woff" {
  const converter: { toSfnt(woff: Buffer): Buffer; toWoff(sfnt: Buffer): Buffer };
  export default converter;
}

declare module "svg-to-pdfkit" {
  function SVGtoPDF(doc: PDFKit.PDFDocument, svg: string, x?: number, y?: number, options?: { width?: number; height?: number; assumePt?: boolean; preserveAspectRatio?: string; fontCallback?: (family: string, bold: boolean, italic: boolean) => string }): void;
  export default SVGtoPDF;
}

declare module "png-chunks-extract" {
  function extract(data: Uint8Array): { name: string; data: Uint8Array }[];
  export default extract;
}

declare module "png-chunks-encode" {
  function encode(chunks: { name: string; data: Uint8Array }[]): Uint8Array;
  export default encode;
}

declare module "png-chunk-text" {
  export function encode(keyword: string, content: string): { name: string; data: Uint8Array };
  export function decode(data: Uint8Array): { keyword: string; text: string };
}
