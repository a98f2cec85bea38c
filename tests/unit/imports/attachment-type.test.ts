import { describe, expect, it } from "vitest";
import { checkAttachment, detectAttachmentKind, servedFormOf, SIGNATURE_BYTES } from "@/lib/imports/attachment-type";
import { MAX_ATTACHMENT_BYTES } from "@/lib/imports/limits";
import { card, fitsFile } from "./fits";
import { refusal } from "./refusal";

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
const JPEG = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46]);
const PDF = new TextEncoder().encode("%PDF-1.7\n%âãÏÓ\n");

describe("detectAttachmentKind (by content)", () => {
  it("knows PNG by its 8-byte signature (PNG Specification 3rd ed. §5.2)", () => {
    expect(detectAttachmentKind(PNG)).toBe("png");
  });

  it("knows JPEG by SOI FF D8 and the next marker's FF (ITU-T T.81 Annex B.1)", () => {
    expect(detectAttachmentKind(JPEG)).toBe("jpeg");
  });

  it('knows PDF by "%PDF-" at the start (ISO 32000-1 §7.5.2)', () => {
    expect(detectAttachmentKind(PDF)).toBe("pdf");
  });

  it('knows FITS by "SIMPLE  =" in columns 1–9 (FITS Standard 4.0 §4.4.1.1)', () => {
    expect(detectAttachmentKind(fitsFile([card("SIMPLE", "T"), card("BITPIX", "8"), card("NAXIS", "0")]))).toBe("fits");
  });

  it("does not trust a name or a near miss: a PNG signature with one wrong byte, HTML, a GIF", () => {
    expect(detectAttachmentKind(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x00]))).toBeNull();
    expect(detectAttachmentKind(new TextEncoder().encode("<html><script>alert(1)</script>"))).toBeNull();
    expect(detectAttachmentKind(new TextEncoder().encode("GIF89a"))).toBeNull();
    expect(detectAttachmentKind(new TextEncoder().encode("SIMPLE ="))).toBeNull();
  });
});

describe("servedFormOf (what the file route answers with)", () => {
  it("serves PNG and JPEG inline as images, PDF and FITS as downloads of their own type", () => {
    expect(servedFormOf(PNG)).toEqual({ mimeType: "image/png", isInline: true });
    expect(servedFormOf(JPEG)).toEqual({ mimeType: "image/jpeg", isInline: true });
    expect(servedFormOf(PDF)).toEqual({ mimeType: "application/pdf", isInline: false });
    expect(servedFormOf(fitsFile([card("SIMPLE", "T"), card("BITPIX", "8"), card("NAXIS", "0")]))).toEqual({ mimeType: "application/fits", isInline: false });
  });

  it("serves HTML, SVG and anything unknown as an opaque download, never as a page (a regression: the declared type was served)", () => {
    for (const text of ["<!DOCTYPE html><script>alert(1)</script>", '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>', ""]) {
      expect(servedFormOf(new TextEncoder().encode(text))).toEqual({ mimeType: "application/octet-stream", isInline: false });
    }
  });

  it("reads the type from no more than the SIGNATURE_BYTES leading bytes", () => {
    expect(SIGNATURE_BYTES).toBe(9);
    const fits = fitsFile([card("SIMPLE", "T"), card("BITPIX", "8"), card("NAXIS", "0")]);
    expect(servedFormOf(fits.subarray(0, SIGNATURE_BYTES)).mimeType).toBe("application/fits");
  });
});

describe("checkAttachment", () => {
  it("returns the kind, the media type to store it with (FITS: RFC 4047) and the size", () => {
    expect(checkAttachment(PNG)).toEqual({ kind: "png", mimeType: "image/png", sizeBytes: PNG.length });
    expect(checkAttachment(PDF).mimeType).toBe("application/pdf");
  });

  it("reads a FITS file's header along with its type", () => {
    const fits = checkAttachment(fitsFile([card("SIMPLE", "T"), card("BITPIX", "16"), card("NAXIS", "1"), card("NAXIS1", "10")], 20));
    expect(fits.mimeType).toBe("application/fits");
    expect(fits.fitsHeader?.hdus[0].dataBytes).toBe(20);
  });

  it("refuses a file whose content is none of the kinds", () => {
    const error = refusal(() => checkAttachment(new TextEncoder().encode("name,ra\n")));
    expect(error.code).toBe("bad_request:attachment");
    expect(error.message).toBe("Attach a PNG or JPEG image, a PDF or a FITS file; this file's content is none of them.");
  });

  it("refuses a FITS signature with a broken header", () => {
    expect(refusal(() => checkAttachment(new TextEncoder().encode("SIMPLE  =                    T".padEnd(2880, "x")))).code).toBe("bad_request:attachment");
  });

  it("refuses an empty file and one over 16 MB (413 kind), and accepts exactly 16 MB", () => {
    expect(refusal(() => checkAttachment(new Uint8Array())).message).toBe("The file is empty.");
    const over = new Uint8Array(MAX_ATTACHMENT_BYTES + 1);
    over.set(PNG);
    const error = refusal(() => checkAttachment(over));
    expect(error.code).toBe("payload_too_large:attachment");
    expect(error.message).toBe("The file is larger than 16 MB, the limit for an attachment.");
    expect(checkAttachment(over.subarray(0, MAX_ATTACHMENT_BYTES)).sizeBytes).toBe(MAX_ATTACHMENT_BYTES);
  });
});
