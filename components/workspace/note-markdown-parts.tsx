import type { ComponentProps } from "react";

/** A URL with a scheme (`https:`…) or a host of its own (`//host/…`): not one of the app's own paths. */
const isOnOtherSite = (url: string) => /^[a-z][a-z0-9+.-]*:/i.test(url) || url.startsWith("//");

/**
 * Only the app's own images load (the Content-Security-Policy's img-src), so an image from another
 * site is shown as a link to it rather than as a broken picture.
 */
export function NoteImage({ src, alt, title }: ComponentProps<"img">) {
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
export const noteClass = [
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
