import { toHtml } from "hast-util-to-html";
import type { FigureTree } from "@/lib/figures/figure-tree";

/**
 * A figure's tree as SVG markup: the same tree the screen draws, serialised with SVG's attribute
 * names (stroke-dasharray, viewBox) and only numeric character references, so the result is XML.
 */
export function figureMarkup(tree: FigureTree): string {
  return toHtml(tree, { space: "svg" });
}
