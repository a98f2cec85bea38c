import type { ComponentProps } from "react";
import ReactMarkdown from "react-markdown";
import rehypeSanitize from "rehype-sanitize";
import remarkGfm from "remark-gfm";

/**
 * A note's Markdown. Raw HTML in the source is never parsed into elements (react-markdown's default)
 * and rehype-sanitize's GitHub schema strips anything unsafe that Markdown itself can express
 * (javascript: links, event handlers), so no script can run from a note.
 */
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

export function Markdown({ source }: { source: string }) {
  return (
    <div className="space-y-2 leading-relaxed [&_a]:text-glint [&_code]:rounded [&_code]:bg-void [&_code]:px-1 [&_li]:ml-5 [&_ol]:list-decimal [&_ul]:list-disc">
      <ReactMarkdown remarkPlugins={[remarkGfm]} rehypePlugins={[rehypeSanitize]} components={{ img: NoteImage }}>
        {source}
      </ReactMarkdown>
    </div>
  );
}
