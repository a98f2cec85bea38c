import "server-only";
import type { ReactElement } from "react";
import { nodeRequire } from "./node-require";

type ReactDomServer = typeof import("react-dom/server");

/** A plot component's SVG as markup, rendered with react-dom/server loaded outside the bundle (see node-require.ts). */
export function renderStaticSvg(element: ReactElement): string {
  return nodeRequire<ReactDomServer>(["react-dom", "server"].join("/")).renderToStaticMarkup(element);
}
