import type { ComponentProps } from "react";
import type { KatexOptions } from "katex";
import ReactMarkdown from "react-markdown";
import rehypeKatex from "rehype-katex";
import rehypeSanitize from "rehype-sanitize";
import remarkGfm from "remark-gfm";
import remarkMath from "remark-math";
import { plotPalette } from "@/lib/figures/plot-palette";
import "katex/dist/katex.min.css";

/**
 * A note's Markdown. Raw HTML in the source is never parsed into elements (react-markdown's default)
 * and rehype-sanitize's GitHub schema strips anything unsafe that Markdown itself can express
 * (javascript: links, event handlers), so no script can run from a note.
 *
 * Math (`$…$` inline, `$$…$$` display) is typeset by KaTeX after the sanitizer: the sanitizer keeps
 * the `language-math` class remark-math puts on the formula's `code` element (the schema allows
 * `language-*` on code), rehype-katex then replaces that element with KaTeX's own markup, which the
 * sanitizer would otherwise strip. KaTeX's output is built from the formula by KaTeX, not copied
 * from the note, and `trust` stays off, so `\href`, `\url`, `\includegraphics` and `\htmlClass`-style
 * commands show as an error in words instead of making links, images or attributes.
 */
const katexOptions: Omit<KatexOptions, "displayMode" | "throwOnError"> = {
  trust: false,
  // A formula KaTeX cannot read shows as its source in the error colour (rehype-katex catches the
  // error), and the rest of the note renders.
  errorColor: plotPalette.vermillion,
  // Notes are not LaTeX documents: Unicode such as θ typed straight into a formula is fine.
  strict: "ignore",
  // Our rule: no `\rule{500em}{500em}` covering the page; 10 em is taller than any fraction.
  maxSize: 10,
};

/** A URL with a scheme (`https:`…) or a host of its own (`//host/…`): not one of the app's own paths. */
const isOnOtherSite = (url: string) => /^[a-z][a-z0-9+.-]*:/i.test(url) || url.startsWith("//");

/**
 * Only the app's own images load (the Content-Security-Policy's img-src), so an image from another
 * site is shown as a link to it rather than as a broken picture.
 */
function NoteImage({ src, alt, title }: ComponentProps<"img">) {
  const url = typeof src === "string" ? src : "";
  if (isOnOtherSite(url)) {
    return (
      <a href={url} title={title} target="_blank" rel="noopener noreferrer nofollow">
        {`Image: ${alt || url}`}
      </a>
    );
  }
  // A source the sanitizer refused (javascript: and the like) leaves the alternative text only.
  if (url === "") return alt ? <span>{alt}</span> : null;
  return <img src={url} alt={alt ?? ""} title={title} />;
}

/** Headings step down from the page's own (h1 title, h2 "Observation notes"); tables get rules and padding. */
const noteClass = [
  "space-y-2 leading-relaxed",
  "[&_a]:text-glint [&_code]:rounded [&_code]:bg-void [&_code]:px-1 [&_li]:ml-5 [&_ol]:list-decimal [&_ul]:list-disc",
  "[&_h1]:mt-3 [&_h1]:text-xl [&_h1]:font-semibold [&_h2]:mt-3 [&_h2]:text-lg [&_h2]:font-semibold",
  "[&_h3]:mt-2 [&_h3]:font-semibold [&_h4]:font-semibold [&_h5]:font-semibold [&_h6]:font-semibold",
  "[&_table]:block [&_table]:max-w-full [&_table]:overflow-x-auto [&_table]:border-collapse [&_table]:text-sm",
  "[&_th]:border-b [&_th]:border-void-edge [&_th]:px-2 [&_th]:py-1 [&_th]:text-left [&_th]:font-semibold",
  "[&_td]:border-b [&_td]:border-void-edge [&_td]:px-2 [&_td]:py-1 [&_td]:align-top",
  "[&_blockquote]:border-l-2 [&_blockquote]:border-void-edge [&_blockquote]:pl-3 [&_blockquote]:text-dusk-dim",
  // A long display equation scrolls inside the note rather than widening the page.
  "[&_.katex-display]:overflow-x-auto [&_.katex-display]:overflow-y-hidden [&_.katex-display]:py-1",
].join(" ");

export function Markdown({ source }: { source: string }) {
  return (
    <div className={noteClass}>
      <ReactMarkdown
        remarkPlugins={[remarkGfm, remarkMath]}
        rehypePlugins={[rehypeSanitize, [rehypeKatex, katexOptions]]}
        components={{ img: NoteImage }}
      >
        {source}
      </ReactMarkdown>
    </div>
  );
}
