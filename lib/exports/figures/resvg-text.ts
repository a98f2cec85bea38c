import "server-only";
import { bundledPdfFaces, type BundledWeight } from "./bundled-font";

/**
 * The SVG for resvg with every line of text that needs more than one face split into runs of one face
 * each, every run placed at its own measured x (a new text chunk, SVG 1.1 §10.7): resvg shapes a
 * chunk in each face a run names and falls back on its own for the rest, and a line such as
 * "Śrī Ωmega" (Latin Extended and Greek) then came out empty. Lines of one face are left as they are.
 */
export function resvgSvg(svg: string): string {
  const inherited: Record<string, string>[] = [];
  let out = "";
  let from = 0;
  const tag = /<(\/?)([a-zA-Z][\w:-]*)((?:\s+[\w:-]+="[^"]*")*)\s*(\/?)>/g;
  for (let match = tag.exec(svg); match !== null; match = tag.exec(svg)) {
    const [whole, closing, name, attributeText, selfClosing] = match;
    if (closing) {
      inherited.pop();
      continue;
    }
    const attributes = attributesOf(attributeText);
    if (name === "text") {
      const end = svg.indexOf("</text>", tag.lastIndex);
      const context = Object.assign({}, ...inherited, attributes) as Record<string, string>;
      out += svg.slice(from, match.index) + laidOut(whole, svg.slice(tag.lastIndex, end), context);
      from = end + "</text>".length;
      tag.lastIndex = from;
      continue;
    }
    if (!selfClosing) inherited.push(attributes);
  }
  return out + svg.slice(from);
}

function attributesOf(text: string): Record<string, string> {
  return Object.fromEntries([...text.matchAll(/(?<![\w:-])([\w:-]+)="([^"]*)"/g)].map(([, key, value]) => [key, value]));
}

const entities: Record<string, string> = { amp: "&", lt: "<", gt: ">", quot: '"', "#x27": "'", "#39": "'" };
const decode = (text: string) => text.replace(/&(#x27|#39|amp|lt|gt|quot);/g, (_, name: string) => entities[name]);
const encode = (text: string) => text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

interface Piece {
  text: string;
  fontSizePx: number;
  /** Baseline offset from the line's y (px, down positive). */
  shiftPx: number;
}

/** A <text> element laid out again when it mixes faces; as it was otherwise. */
function laidOut(open: string, inner: string, context: Record<string, string>): string {
  const weight: BundledWeight = Number(context["font-weight"] ?? 400) >= 600 ? 600 : 400;
  const faces = bundledPdfFaces(weight);
  const faceOf = (character: string) => faces.find((face) => face.hasGlyph(character.codePointAt(0)!)) ?? faces[0];
  const baseSizePx = Number(context["font-size"] ?? 16);
  const lines: { x: number | null; dyPx: number; pieces: Piece[] }[] = [{ x: null, dyPx: 0, pieces: [] }];
  let shiftPx = 0;
  for (const part of inner.split(/(<tspan\b[^>]*>[^<]*<\/tspan>)/)) {
    if (part === "") continue;
    const span = /^<tspan\b([^>]*)>([^<]*)<\/tspan>$/.exec(part);
    const attributes = span ? attributesOf(span[1]) : {};
    const text = decode(span ? span[2] : part);
    const dyPx = Number(attributes.dy ?? 0);
    if (attributes.x !== undefined) {
      lines.push({ x: Number(attributes.x), dyPx: shiftPx + dyPx, pieces: [] });
      shiftPx = 0;
    } else shiftPx += dyPx;
    lines.at(-1)!.pieces.push({ text, fontSizePx: Number(attributes["font-size"] ?? baseSizePx), shiftPx });
  }
  const allText = lines.flatMap((line) => line.pieces.map((piece) => piece.text)).join("");
  if (new Set([...allText].map((character) => faceOf(character).name)).size <= 1) return `${open}${inner}</text>`;

  const x0 = Number(context.x ?? 0);
  const y0 = Number(context.y ?? 0);
  const anchor = context["text-anchor"] ?? "start";
  let lineY = y0;
  const runs: string[] = [];
  for (const line of lines) {
    lineY += line.dyPx;
    const pieceRuns = line.pieces.flatMap((piece) => {
      const cut: { text: string; family: string; widthPx: number; piece: Piece }[] = [];
      for (const character of piece.text) {
        const face = faceOf(character);
        const last = cut.at(-1);
        if (last?.family === face.resvgFamily) last.text += character;
        else cut.push({ text: character, family: face.resvgFamily, widthPx: 0, piece });
      }
      for (const run of cut) run.widthPx = faces.find((face) => face.resvgFamily === run.family)!.widthEm(run.text) * piece.fontSizePx;
      return cut;
    });
    const widthPx = pieceRuns.reduce((sum, run) => sum + run.widthPx, 0);
    let x = (line.x ?? x0) - (anchor === "middle" ? widthPx / 2 : anchor === "end" ? widthPx : 0);
    for (const run of pieceRuns) {
      const y = lineY + run.piece.shiftPx;
      runs.push(`<tspan x="${round(x)}" y="${round(y)}" font-family="${run.family}" font-size="${run.piece.fontSizePx}">${encode(run.text)}</tspan>`);
      x += run.widthPx;
    }
  }
  const startAnchored = open.replace(/\stext-anchor="[^"]*"/, "").replace(/^<text/, '<text text-anchor="start"');
  return `${startAnchored}${runs.join("")}</text>`;
}

const round = (value: number) => Math.round(value * 100) / 100;
