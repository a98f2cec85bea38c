import { Fragment, jsx, jsxs } from "react/jsx-runtime";
import { toJsxRuntime } from "hast-util-to-jsx-runtime";
import type { FigureTree } from "@/lib/figures/figure-tree";

/**
 * Draws a figure's tree (lib/figures) as React SVG elements: the same elements, attributes and text
 * the exports write as markup. Hook-free, so server and client components alike can draw with it;
 * a client component that redraws often should memoise the tree it passes.
 */
export function FigureSvg({ tree }: { tree: FigureTree }) {
  return toJsxRuntime(tree, { Fragment, jsx, jsxs, space: "svg" });
}
