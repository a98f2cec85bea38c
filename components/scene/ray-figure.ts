/**
 * The saved figure of the 3D view: the scene (drawn in print ink on white) with a scale bar in M and,
 * for a known mass, in km or au; the horizon (2M) and photon sphere (3M), or the lens's surface,
 * labelled; an arrow toward the observer; and a caption and key below. Every length, line width and
 * font size is in CSS pixels times the export scale, so a 4× figure is the 1× figure, sharper.
 */
import * as THREE from "three";
import { formatPlain } from "@/lib/bench/display-units";
import { plotFont, printPalette } from "@/lib/figures/plot-palette";
import type { PngScale } from "./png-scale";
import { physicalLengthText, scaleBarLengthM } from "./ray-figure-text";

const INK = printPalette.text;
const PAPER = printPalette.ground;
/** Base sizes, CSS pixels (multiplied by the export scale). */
const LABEL_FONT_PX = 12;
const CAPTION_FONT_PX = 13;
const LINE_PX = 1.5;
const MARGIN_PX = 12;

export interface FigureKeyEntry {
  label: string;
  color: string;
  /** Canvas dash pattern, CSS pixels; empty for a solid line. */
  dashPx: number[];
}

/** What the figure says about the view: the page knows it, the scene does not. */
export interface RayFigureLabels {
  /** The lens's body radius (units of M) when it lies outside the photon sphere; 0 for a compact lens. */
  surfaceRadiusM: number;
  /** Undefined when the scale bar can only be given in M. */
  massSolar: number | undefined;
  caption: string;
  key: FigureKeyEntry[];
}

export interface RayFigureRequest extends RayFigureLabels {
  /** The WebGL canvas, drawn in print ink at the export scale. */
  view: HTMLCanvasElement;
  camera: THREE.Camera;
  scale: PngScale;
}

/** A world point (units of M) in the view's drawing-buffer pixels. */
function toPixels(point: THREE.Vector3, camera: THREE.Camera, view: HTMLCanvasElement): { x: number; y: number } {
  const ndc = point.clone().project(camera);
  return { x: ((ndc.x + 1) / 2) * view.width, y: ((1 - ndc.y) / 2) * view.height };
}

/** Words split into lines no wider than `widthPx` in the context's current font. */
function wrapText(context: CanvasRenderingContext2D, text: string, widthPx: number): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(" ")) {
    const candidate = line === "" ? word : `${line} ${word}`;
    if (line !== "" && context.measureText(candidate).width > widthPx) {
      lines.push(line);
      line = word;
    } else {
      line = candidate;
    }
  }
  if (line !== "") lines.push(line);
  return lines;
}

/** Text with a white halo, so it reads over the rays. */
function haloText(context: CanvasRenderingContext2D, text: string, x: number, y: number, s: number) {
  context.lineWidth = 3 * s;
  context.strokeStyle = PAPER;
  context.lineJoin = "round";
  context.strokeText(text, x, y);
  context.fillStyle = INK;
  context.fillText(text, x, y);
}

function arrowHead(context: CanvasRenderingContext2D, tip: { x: number; y: number }, angleRad: number, sizePx: number) {
  context.beginPath();
  context.moveTo(tip.x, tip.y);
  context.lineTo(tip.x - sizePx * Math.cos(angleRad - 0.4), tip.y - sizePx * Math.sin(angleRad - 0.4));
  context.lineTo(tip.x - sizePx * Math.cos(angleRad + 0.4), tip.y - sizePx * Math.sin(angleRad + 0.4));
  context.closePath();
  context.fill();
}

/** A leader line from the sphere's rim at `angleRad` (screen, clockwise from +x) out to its label. */
function sphereLabel(context: CanvasRenderingContext2D, centre: { x: number; y: number }, radiusPx: number, angleRad: number, text: string, s: number) {
  const rim = { x: centre.x + radiusPx * Math.cos(angleRad), y: centre.y + radiusPx * Math.sin(angleRad) };
  const reach = radiusPx + 36 * s;
  const end = { x: centre.x + reach * Math.cos(angleRad), y: centre.y + reach * Math.sin(angleRad) };
  context.strokeStyle = INK;
  context.lineWidth = LINE_PX * s * 0.7;
  context.beginPath();
  context.moveTo(rim.x, rim.y);
  context.lineTo(end.x, end.y);
  context.lineTo(end.x + 8 * s, end.y);
  context.stroke();
  context.textAlign = "left";
  context.textBaseline = "middle";
  haloText(context, text, end.x + 11 * s, end.y, s);
}

function drawScaleBar(context: CanvasRenderingContext2D, pxPerM: number, massSolar: number | undefined, view: HTMLCanvasElement, s: number) {
  const lengthM = scaleBarLengthM(pxPerM, view.width * 0.25);
  const barPx = lengthM * pxPerM;
  const left = MARGIN_PX * 2 * s;
  const y = view.height - MARGIN_PX * 2.5 * s;
  const lines = [`${lengthM} M`, ...(massSolar === undefined ? [] : [`= ${physicalLengthText(lengthM, massSolar)}`])];
  context.font = `${LABEL_FONT_PX * s}px ${plotFont}`;
  const boxWidth = Math.max(barPx, ...lines.map((line) => context.measureText(line).width)) + 12 * s;
  context.fillStyle = "rgba(255, 255, 255, 0.85)";
  context.fillRect(left - 6 * s, y - (LABEL_FONT_PX + 10) * s, boxWidth, (LABEL_FONT_PX * lines.length + 18) * s);
  context.strokeStyle = INK;
  context.lineWidth = 2 * LINE_PX * s;
  context.beginPath();
  context.moveTo(left, y - 4 * s);
  context.lineTo(left, y + 4 * s);
  context.moveTo(left, y);
  context.lineTo(left + barPx, y);
  context.moveTo(left + barPx, y - 4 * s);
  context.lineTo(left + barPx, y + 4 * s);
  context.stroke();
  context.fillStyle = INK;
  context.textAlign = "left";
  context.textBaseline = "bottom";
  context.fillText(lines[0], left, y - 6 * s);
  context.textBaseline = "top";
  if (lines[1] !== undefined) context.fillText(lines[1], left, y + 6 * s);
}

/** An arrow in the top-right corner along +x, where the escaping rays go: toward the distant observer. */
function drawObserverArrow(context: CanvasRenderingContext2D, camera: THREE.Camera, view: HTMLCanvasElement, pxPerM: number, s: number) {
  const origin = toPixels(new THREE.Vector3(0, 0, 0), camera, view);
  const along = toPixels(new THREE.Vector3(1, 0, 0), camera, view);
  const dx = along.x - origin.x;
  const dy = along.y - origin.y;
  const lengthPx = Math.hypot(dx, dy);
  const base = { x: view.width - 110 * s, y: MARGIN_PX * 3 * s };
  context.strokeStyle = INK;
  context.fillStyle = INK;
  context.lineWidth = LINE_PX * s;
  context.font = `${LABEL_FONT_PX * s}px ${plotFont}`;
  context.textBaseline = "middle";
  context.textAlign = "left";
  // Seen nearly along x, the observer lies toward or away from the reader: a dot or a cross in a circle.
  if (lengthPx < 0.25 * pxPerM) {
    const toViewer = new THREE.Vector3(1, 0, 0).dot(camera.getWorldDirection(new THREE.Vector3())) < 0;
    const r = 7 * s;
    context.beginPath();
    context.arc(base.x, base.y, r, 0, 2 * Math.PI);
    context.stroke();
    if (toViewer) {
      context.beginPath();
      context.arc(base.x, base.y, 2 * s, 0, 2 * Math.PI);
      context.fill();
    } else {
      context.beginPath();
      context.moveTo(base.x - r * 0.7, base.y - r * 0.7);
      context.lineTo(base.x + r * 0.7, base.y + r * 0.7);
      context.moveTo(base.x + r * 0.7, base.y - r * 0.7);
      context.lineTo(base.x - r * 0.7, base.y + r * 0.7);
      context.stroke();
    }
    haloText(context, toViewer ? "observer: toward you" : "observer: away from you", base.x + r + 6 * s, base.y, s);
    return;
  }
  const angleRad = Math.atan2(dy, dx);
  const arrowPx = 44 * s;
  const tail = { x: base.x - (arrowPx / 2) * Math.cos(angleRad), y: base.y + 10 * s - (arrowPx / 2) * Math.sin(angleRad) };
  const tip = { x: tail.x + arrowPx * Math.cos(angleRad), y: tail.y + arrowPx * Math.sin(angleRad) };
  context.beginPath();
  context.moveTo(tail.x, tail.y);
  context.lineTo(tip.x, tip.y);
  context.stroke();
  arrowHead(context, tip, angleRad, 8 * s);
  context.textAlign = "center";
  haloText(context, "to observer (+x)", base.x, base.y - 14 * s, s);
}

function drawCaption(context: CanvasRenderingContext2D, lines: string[], key: FigureKeyEntry[], top: number, width: number, s: number) {
  const left = MARGIN_PX * s;
  const lineHeight = CAPTION_FONT_PX * 1.35 * s;
  context.fillStyle = INK;
  context.textAlign = "left";
  context.textBaseline = "top";
  context.font = `${CAPTION_FONT_PX * s}px ${plotFont}`;
  lines.forEach((line, index) => context.fillText(line, left, top + index * lineHeight));
  let x = left;
  const y = top + lines.length * lineHeight + lineHeight / 2;
  context.textBaseline = "middle";
  for (const entry of key) {
    context.strokeStyle = entry.color;
    context.lineWidth = 2.5 * s;
    context.setLineDash(entry.dashPx.map((dash) => dash * s));
    context.beginPath();
    context.moveTo(x, y);
    context.lineTo(x + 28 * s, y);
    context.stroke();
    context.setLineDash([]);
    context.fillStyle = INK;
    context.fillText(entry.label, x + 34 * s, y);
    x += 34 * s + context.measureText(entry.label).width + 18 * s;
    if (x > width - 100 * s) break;
  }
}

/** The figure as a new canvas: the view above, the caption and key below on the same white page. */
export function composeRayFigure({ view, camera, scale, surfaceRadiusM, massSolar, caption, key }: RayFigureRequest): HTMLCanvasElement {
  const s = scale;
  const figure = document.createElement("canvas");
  const measure = figure.getContext("2d")!;
  measure.font = `${CAPTION_FONT_PX * s}px ${plotFont}`;
  const captionLines = wrapText(measure, caption, view.width - 2 * MARGIN_PX * s);
  const bandPx = Math.ceil((MARGIN_PX + CAPTION_FONT_PX * 1.35 * (captionLines.length + 1) + MARGIN_PX) * s);
  figure.width = view.width;
  figure.height = view.height + bandPx;
  const context = figure.getContext("2d")!;
  context.fillStyle = PAPER;
  context.fillRect(0, 0, figure.width, figure.height);
  context.drawImage(view, 0, 0);

  camera.updateMatrixWorld();
  const origin = new THREE.Vector3(0, 0, 0);
  const right = new THREE.Vector3().setFromMatrixColumn(camera.matrixWorld, 0).normalize();
  const centre = toPixels(origin, camera, view);
  const rightPx = toPixels(right, camera, view);
  // Pixels per unit of M at the lens (the scale bar holds there; nearer or farther parts differ in perspective).
  const pxPerM = Math.hypot(rightPx.x - centre.x, rightPx.y - centre.y);

  context.font = `${LABEL_FONT_PX * s}px ${plotFont}`;
  if (surfaceRadiusM > 0) {
    sphereLabel(context, centre, surfaceRadiusM * pxPerM, -Math.PI / 4, `lens surface, R = ${formatPlain(surfaceRadiusM, 3)} M`, s);
  } else {
    sphereLabel(context, centre, 3 * pxPerM, -Math.PI / 3, "photon sphere, r = 3M", s);
    sphereLabel(context, centre, 2 * pxPerM, Math.PI / 3, "horizon, r = 2M", s);
  }
  drawScaleBar(context, pxPerM, massSolar, view, s);
  drawObserverArrow(context, camera, view, pxPerM, s);

  context.strokeStyle = INK;
  context.lineWidth = 0.75 * s;
  context.beginPath();
  context.moveTo(0, view.height + 0.5 * s);
  context.lineTo(figure.width, view.height + 0.5 * s);
  context.stroke();
  drawCaption(context, captionLines, key, view.height + MARGIN_PX * s, figure.width, s);
  return figure;
}
