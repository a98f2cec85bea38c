import type { KatexOptions } from "katex";
import ReactMarkdown from "react-markdown";
import rehypeKatex from "rehype-katex";
import rehypeSanitize from "rehype-sanitize";
import remarkGfm from "remark-gfm";
import remarkMath from "remark-math";
import { plotPalette } from "@/lib/figures/plot-palette";
import { NoteImage, noteClass } from "./note-markdown-parts";
import "katex/dist/katex.min.css";

/**
 * A note's Markdown with its math: `$…$` inline and `$$…$$` display, typeset by KaTeX after the
 * sanitizer. The sanitizer keeps the `language-math` class remark-math puts on the formula's `code`
 * element (the schema allows `language-*` on code); rehype-katex then replaces that element with
 * KaTeX's own markup, which the sanitizer would otherwise strip. KaTeX's output is built from the
 * formula by KaTeX, not copied from the note, and `trust` stays off, so `\href`, `\url`,
 * `\includegraphics` and `\htmlClass`-style commands show as an error in words instead of making
 * links, images or attributes. Loaded only for a note that may hold math (`Markdown`).
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

export function MathMarkdown({ source }: { source: string }) {
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
