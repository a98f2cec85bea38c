import type { Element } from "hast";
import type { Result } from "hastscript";

/**
 * One figure, or one part of it, as a hast SVG element tree: pure data built once from the figure's
 * inputs, drawn on screen by React (components/figures/figure-svg.tsx) and written as SVG markup by
 * the exports (lib/exports/figures), so both show the same elements, attributes and text.
 */
export type FigureTree = Element;

/**
 * The element a tag-name JSX expression builds. hastscript types every JSX result as a root or an
 * element; a tag name always gives an element, and this says so to the type checker.
 */
export function svgElement(result: Result): FigureTree {
  if (result.type !== "element") throw new Error("A figure part must be one SVG element, not a fragment.");
  return result;
}
