import ReactMarkdown from "react-markdown";
import rehypeSanitize from "rehype-sanitize";
import remarkGfm from "remark-gfm";

/**
 * A note's Markdown. Raw HTML in the source is never parsed into elements (react-markdown's default)
 * and rehype-sanitize's GitHub schema strips anything unsafe that Markdown itself can express
 * (javascript: links, event handlers), so no script can run from a note.
 */
export function Markdown({ source }: { source: string }) {
  return (
    <div className="space-y-2 leading-relaxed [&_a]:text-glint [&_code]:rounded [&_code]:bg-void [&_code]:px-1 [&_li]:ml-5 [&_ol]:list-decimal [&_ul]:list-disc">
      <ReactMarkdown remarkPlugins={[remarkGfm]} rehypePlugins={[rehypeSanitize]}>
        {source}
      </ReactMarkdown>
    </div>
  );
}
