import { z } from "zod";
import { figureDataFormats } from "@/lib/exports/figure-data/formats";
import { MAX_PNG_DPI, MAX_PNG_WIDTH_PX, MIN_PNG_DPI, MIN_PNG_WIDTH_PX } from "./png-limits";

/** The figure itself (SVG, PNG, PDF), or the data it draws as a table (`figureDataFormats`). */
export const figureFormats = ["svg", "png", "pdf", ...figureDataFormats] as const;
export type FigureFormat = (typeof figureFormats)[number];

/** `format`, and for PNG the pixel `width` and the `dpi` written into the file. */
export const figureFormatQuerySchema = z.object({
  format: z.enum(figureFormats, { error: `The format must be one of ${figureFormats.join(", ")}.` }).default("svg"),
  width: z.coerce
    .number({ error: "The width must be a number of pixels." })
    .int("The width must be a whole number of pixels.")
    .min(MIN_PNG_WIDTH_PX, `The width is at least ${MIN_PNG_WIDTH_PX} px.`)
    .max(MAX_PNG_WIDTH_PX, `The width is at most ${MAX_PNG_WIDTH_PX} px.`)
    .default(2000),
  dpi: z.coerce
    .number({ error: "The DPI must be a number." })
    .int("The DPI must be a whole number.")
    .min(MIN_PNG_DPI, `The DPI is at least ${MIN_PNG_DPI}.`)
    .max(MAX_PNG_DPI, `The DPI is at most ${MAX_PNG_DPI}.`)
    .default(300),
});

export type FigureFormatQuery = z.infer<typeof figureFormatQuerySchema>;
