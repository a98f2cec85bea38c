/** @jsxImportSource hastscript/svg */
import type { ElementContent } from "hast";
import { raisedPowerParts } from "@/lib/physics/quantity-vocabulary";
import { svgElement } from "./figure-tree";

/**
 * Label text with real subscripts and superscripts: `θ_E`, `t_0`, `b_c` (one character after `_`),
 * `_{ab}` and `^{−3}` for longer runs, and superscript characters as written by the number formatter
 * ("10⁻³", drawn as `^{−3}`: the bundled faces lack their glyphs). Each script is a `<tspan>` shifted by `dy` in smaller type, the
 * text after it shifted back, which browsers, resvg and svg-to-pdfkit all lay out the same way.
 */
export function plotText({ text, fontSize }: { text: string; fontSize: number }): ElementContent[] {
  const parts = scriptParts(text);
  if (parts.length === 1 && parts[0].shift === 0) return [{ type: "text", value: text }];
  const scriptSize = Math.round(fontSize * 0.72 * 10) / 10;
  const nodes: ElementContent[] = [];
  let baseline = 0;
  parts.forEach((part) => {
    const offset = Math.round(part.shift * fontSize * 10) / 10;
    const dy = offset - baseline;
    baseline = offset;
    if (dy === 0 && part.shift === 0) nodes.push({ type: "text", value: part.text });
    else
      nodes.push(
        svgElement(
          <tspan dy={dy === 0 ? undefined : dy} fontSize={part.shift === 0 ? undefined : scriptSize}>
            {part.text}
          </tspan>,
        ),
      );
  });
  return nodes;
}

/** Baseline shift of a subscript and a superscript, in em (down is positive, as SVG's y). */
const SUBSCRIPT_EM = 0.28;
const SUPERSCRIPT_EM = -0.38;

/** The label cut into runs on the baseline (shift 0), subscript or superscript. */
export function scriptParts(text: string): { text: string; shift: number }[] {
  const parts: { text: string; shift: number }[] = [];
  const push = (run: string, shift: number) => {
    if (run === "") return;
    const last = parts.at(-1);
    if (last && last.shift === shift) last.text += run;
    else parts.push({ text: run, shift });
  };
  const pushLine = (run: string) => {
    for (const part of raisedPowerParts(run)) push(part.text, part.isRaised ? SUPERSCRIPT_EM : 0);
  };
  const pattern = /([_^])(?:\{([^}]*)\}|([\p{L}\p{N}]))/gu;
  let from = 0;
  for (const match of text.matchAll(pattern)) {
    pushLine(text.slice(from, match.index));
    push(match[2] ?? match[3], match[1] === "_" ? SUBSCRIPT_EM : SUPERSCRIPT_EM);
    from = match.index + match[0].length;
  }
  pushLine(text.slice(from));
  return parts.length === 0 ? [{ text: "", shift: 0 }] : parts;
}

/** The label as plain text (for accessible names and widths): scripts without their markers. */
export function plainText(text: string): string {
  return scriptParts(text)
    .map((part) => part.text)
    .join("");
}
