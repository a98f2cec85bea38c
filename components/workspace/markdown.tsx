import dynamic from "next/dynamic";
import ReactMarkdown from "react-markdown";
import rehypeSanitize from "rehype-sanitize";
import remarkGfm from "remark-gfm";
import { NoteImage, noteClass } from "./note-markdown-parts";

/** KaTeX and its styles (about 300 kB) load with the first note that may hold math. */
const MathMarkdown = dynamic(() => import("./note-math-markdown").then((module) => module.MathMarkdown));

/**
 * A note's Markdown. Raw HTML in the source is never parsed into elements (react-markdown's default)
 * and rehype-sanitize's GitHub schema strips anything unsafe that Markdown itself can express
 * (javascript: links, event handlers), so no script can run from a note. A note with a dollar sign
 * may hold math and is typeset by `MathMarkdown` (KaTeX, after the same sanitizer).
 */
export function Markdown({ source }: { source: string }) {
  if (source.includes("$")) return <MathMarkdown source={source} />;
  return (
    <div className={noteClass}>
      <ReactMarkdown remarkPlugins={[remarkGfm]} rehypePlugins={[rehypeSanitize]} components={{ img: NoteImage }}>
        {source}
      </ReactMarkdown>
    </div>
  );
}
