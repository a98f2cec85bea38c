/**
 * The saved figure of the 3D view, drawn on a 2D canvas at the export scale from the bundle itself
 * (projected through the view's camera as it is turned), not read back from the screen: every line
 * width, dash, font size and margin is in CSS pixels times the scale, so a 4× figure is the 1×
 * figure, sharper, with lines 4 pixels wide rather than 1. On white in print ink: the scale's rings
 * labelled in M and, for a known mass, in km or au, the lens, the rays as coloured on screen and cut at
 * the time slider's time, the wavefronts, the axis toward the observer, a scale bar, and below, the
 * caption and the key (fates by colour and dash, or the colour ramp with its values).
 */
import * as THREE from "three";
import { RAY_FATES, type AssembledBundle } from "@/lib/ray-view/assemble-bundle";
import { densityOpacity, rampStops, type QuantityScale } from "@/lib/ray-view/colour";
import { OBSERVER_AXIS_LABEL, physicalLengthText, ringLabelPlacement, ringLabelText, scaleBarLengthM, type ScaleRing } from "@/lib/ray-view/scale";
import { pathUpToTime } from "@/lib/ray-view/time";
import { plotFont, printPalette } from "@/lib/figures/plot-palette";
import { fateStyles } from "./fate-styles";
import type { PngScale } from "./png-scale";
import { sceneInks } from "./scene-colours";

const INK = printPalette.text;
const PAPER = printPalette.ground;
/** Base sizes, CSS pixels (multiplied by the export scale). */
const LABEL_FONT_PX = 12;
const CAPTION_FONT_PX = 13;
const LINE_PX = 1.5;
const MARGIN_PX = 12;
/** Widths of the drawn lines, CSS pixels: rays, a ray's head at the time slider's front, fronts and their white edge, rings. */
const RAY_PX = 1;
const HEAD_PX = 1.75;
const FRONT_PX = 1.25;
const FRONT_EDGE_PX = 3.5;
const RING_PX = 0.75;
/** The colour ramp's bar in the key, CSS pixels. */
const RAMP_WIDTH_PX = 240;
const RAMP_HEIGHT_PX = 10;
/** Horizon radius, units of M: what hides rays behind a compact lens. */
const HORIZON_M = 2;

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
  /** The colour ramp's scale when the rays are coloured by a quantity; undefined: by fate. */
  ramp: QuantityScale | undefined;
}

export interface RayFigureRequest extends RayFigureLabels {
  /** The view's size on screen, CSS pixels. */
  widthPx: number;
  heightPx: number;
  camera: THREE.Camera;
  scale: PngScale;
  bundle: AssembledBundle | undefined;
  /** Each ray's print colour, [r, g, b] 0–255 per ray. */
  rayColours: Uint8Array | undefined;
  /** The time slider's time and the rays' bright head (units of M); +∞ and 0 for whole paths. */
  timeM: number;
  headM: number;
  rings: ScaleRing[];
  /** Where the axis toward the observer ends (x, units of M). */
  axisTipM: number;
}

/** Projects world points (units of M) into the figure's pixels through the view's camera. */
class FigureProjection {
  private readonly matrix: number[];
  readonly cameraPosition: THREE.Vector3;

  constructor(
    camera: THREE.Camera,
    readonly width: number,
    readonly height: number,
  ) {
    camera.updateMatrixWorld();
    this.matrix = new THREE.Matrix4().multiplyMatrices(camera.projectionMatrix, camera.matrixWorldInverse).elements;
    this.cameraPosition = camera.getWorldPosition(new THREE.Vector3());
  }

  /** Pixel x, y of a point, or undefined behind the camera. */
  point(x: number, y: number, z: number): { x: number; y: number } | undefined {
    const m = this.matrix;
    const w = m[3] * x + m[7] * y + m[11] * z + m[15];
    if (!(w > 0)) return undefined;
    return { x: ((m[0] * x + m[4] * y + m[8] * z + m[12]) / w + 1) * 0.5 * this.width, y: (1 - (m[1] * x + m[5] * y + m[9] * z + m[13]) / w) * 0.5 * this.height };
  }

  /** Whether the sphere of radius `radiusM` about the origin hides the point from the camera. */
  isHidden(x: number, y: number, z: number, radiusM: number): boolean {
    const c = this.cameraPosition;
    const [dx, dy, dz] = [x - c.x, y - c.y, z - c.z];
    const a = dx * dx + dy * dy + dz * dz;
    const b = 2 * (c.x * dx + c.y * dy + c.z * dz);
    const discriminant = b * b - 4 * a * (c.x * c.x + c.y * c.y + c.z * c.z - radiusM * radiusM);
    if (discriminant <= 0 || a === 0) return false;
    const entry = (-b - Math.sqrt(discriminant)) / (2 * a);
    return entry > 0 && entry < 1 - 1e-6;
  }
}

/** A world point (units of M) in the figure's pixels (off the picture when behind the camera). */
function toPixels(point: THREE.Vector3, projection: FigureProjection): { x: number; y: number } {
  return projection.point(point.x, point.y, point.z) ?? { x: Number.NaN, y: Number.NaN };
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

function drawScaleBar(context: CanvasRenderingContext2D, pxPerM: number, massSolar: number | undefined, width: number, height: number, s: number) {
  const lengthM = scaleBarLengthM(pxPerM, width * 0.25);
  const barPx = lengthM * pxPerM;
  const left = MARGIN_PX * 2 * s;
  const y = height - MARGIN_PX * 2.5 * s;
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

/** The lens: the horizon as a black disc (a compact lens), or the body as a light disc with its rim. */
function drawLens(context: CanvasRenderingContext2D, projection: FigureProjection, camera: THREE.Camera, surfaceRadiusM: number) {
  const radiusM = surfaceRadiusM > 0 ? surfaceRadiusM : HORIZON_M;
  const centre = projection.point(0, 0, 0);
  const distanceM = projection.cameraPosition.length();
  if (centre === undefined && distanceM > radiusM) return;
  const fovRad = camera instanceof THREE.PerspectiveCamera ? (camera.fov * Math.PI) / 180 : Math.PI / 4;
  const focalPx = projection.height / 2 / Math.tan(fovRad / 2);
  // A sphere seen from distance d fills a cone of half-angle asin(R/d); from inside, the whole picture.
  const radiusPx = distanceM > radiusM ? focalPx * Math.tan(Math.asin(radiusM / distanceM)) : Math.hypot(projection.width, projection.height);
  const at = centre ?? { x: projection.width / 2, y: projection.height / 2 };
  const ink = surfaceRadiusM > 0 ? sceneInks.surface.print : sceneInks.horizon.print;
  context.globalAlpha = ink.opacity;
  context.fillStyle = ink.color;
  context.beginPath();
  context.arc(at.x, at.y, radiusPx, 0, 2 * Math.PI);
  context.fill();
  context.globalAlpha = 1;
}

/** The scale's rings in the rays' plane (z = 0), as in the view. */
function drawRingLines(context: CanvasRenderingContext2D, projection: FigureProjection, rings: ScaleRing[], s: number) {
  const points = 192;
  for (const ring of rings) {
    const ink = ring.kind === "photon-sphere" ? sceneInks.photonSphere.print : sceneInks.scale.print;
    context.strokeStyle = ink.color;
    context.globalAlpha = ink.opacity;
    context.lineWidth = RING_PX * s * (ring.kind === "round" ? 1 : 1.5);
    context.beginPath();
    let isPenDown = false;
    for (let k = 0; k <= points; k++) {
      const angle = (2 * Math.PI * k) / points;
      const at = projection.point(ring.radiusM * Math.cos(angle), ring.radiusM * Math.sin(angle), 0);
      if (at === undefined) {
        isPenDown = false;
        continue;
      }
      if (isPenDown) context.lineTo(at.x, at.y);
      else context.moveTo(at.x, at.y);
      isPenDown = true;
    }
    context.stroke();
  }
  context.globalAlpha = 1;
}

/** The rings' labels, placed as in the view, over everything drawn before them. */
function drawRingLabels(context: CanvasRenderingContext2D, projection: FigureProjection, rings: ScaleRing[], s: number) {
  context.font = `${LABEL_FONT_PX * s}px ${plotFont}`;
  for (const ring of rings) {
    const { angleRad, side } = ringLabelPlacement(ring);
    const at = projection.point(ring.radiusM * Math.cos(angleRad), ring.radiusM * Math.sin(angleRad), 0);
    if (at === undefined) continue;
    context.textAlign = side === "left" ? "right" : "left";
    context.textBaseline = "top";
    const dx = side === "left" ? -4 * s : 4 * s;
    haloText(context, ringLabelText(ring), at.x + dx, at.y + 2 * s, s);
  }
}

/** Every vertex of the bundle in the figure's pixels, and whether the lens hides it. */
function projectBundle(bundle: AssembledBundle, projection: FigureProjection, lensRadiusM: number): { xy: Float32Array; isVisible: Uint8Array } {
  const count = bundle.vertices.length / 3;
  const xy = new Float32Array(2 * count);
  const isVisible = new Uint8Array(count);
  const v = bundle.vertices;
  for (let p = 0; p < count; p++) {
    const at = projection.point(v[3 * p], v[3 * p + 1], v[3 * p + 2]);
    if (at === undefined || projection.isHidden(v[3 * p], v[3 * p + 1], v[3 * p + 2], lensRadiusM)) continue;
    xy[2 * p] = at.x;
    xy[2 * p + 1] = at.y;
    isVisible[p] = 1;
  }
  return { xy, isVisible };
}

/** The golden ratio's fractional part: per-ray dash offsets spread evenly, as in the view. */
const GOLDEN_FRACTION = (Math.sqrt(5) - 1) / 2;

/** The rays, each cut where it stands at the time slider's time, with its head drawn strong. */
function drawRays(context: CanvasRenderingContext2D, request: RayFigureRequest, projection: FigureProjection, s: number) {
  const { bundle, rayColours, timeM, headM } = request;
  if (bundle === undefined || rayColours === undefined) return;
  const lensRadiusM = request.surfaceRadiusM > 0 ? request.surfaceRadiusM : HORIZON_M;
  const { xy, isVisible } = projectBundle(bundle, projection, lensRadiusM);
  const density = densityOpacity(bundle.rayCount);
  context.lineJoin = "round";
  context.lineCap = "butt";
  /** Traces points [from, to) of the projected bundle, lifting the pen over hidden points; then the tip. */
  const trace = (from: number, to: number, tip: [number, number, number] | undefined) => {
    let isPenDown = false;
    for (let p = from; p < to; p++) {
      if (isVisible[p] === 0) {
        isPenDown = false;
        continue;
      }
      if (isPenDown) context.lineTo(xy[2 * p], xy[2 * p + 1]);
      else context.moveTo(xy[2 * p], xy[2 * p + 1]);
      isPenDown = true;
    }
    const at = tip === undefined || projection.isHidden(...tip, lensRadiusM) ? undefined : projection.point(...tip);
    if (at !== undefined && isPenDown) context.lineTo(at.x, at.y);
  };
  for (let ray = 0; ray < bundle.rayCount; ray++) {
    const first = bundle.rayFirstPoint[ray];
    const { shownPoints, tip } = pathUpToTime(bundle.vertices, bundle.vertexTimesM, first, bundle.rayFirstPoint[ray + 1], timeM);
    if (shownPoints === 0) continue;
    const style = fateStyles[RAY_FATES[bundle.rayFates[ray]]];
    const dash = (style.legendDash?.split(" ").map(Number) ?? []).map((length) => length * s);
    context.strokeStyle = `rgb(${rayColours[3 * ray]}, ${rayColours[3 * ray + 1]}, ${rayColours[3 * ray + 2]})`;
    context.globalAlpha = style.print.opacity * density;
    context.lineWidth = RAY_PX * s;
    context.setLineDash(dash);
    context.lineDashOffset = ((ray * GOLDEN_FRACTION) % 1) * dash.reduce((sum, length) => sum + length, 0);
    context.beginPath();
    trace(first, first + shownPoints, tip);
    context.stroke();
    if (headM > 0) {
      let headFrom = first + shownPoints;
      while (headFrom > first && timeM - bundle.vertexTimesM[headFrom - 1] < headM) headFrom--;
      context.globalAlpha = 1;
      context.lineWidth = HEAD_PX * s;
      context.setLineDash([]);
      context.beginPath();
      // From the point before the head, so a head shorter than one drawn segment still shows.
      trace(Math.max(first, headFrom - 1), first + shownPoints, tip);
      context.stroke();
    }
  }
  context.setLineDash([]);
  context.globalAlpha = 1;
}

/** The wavefronts the time slider has reached, each over a white edge so it reads across the rays. */
function drawFronts(context: CanvasRenderingContext2D, request: RayFigureRequest, projection: FigureProjection, s: number) {
  const { bundle, timeM } = request;
  if (bundle === undefined) return;
  const v = bundle.wavefrontVertices;
  const segments: [number, number, number, number][] = [];
  for (let i = 0; i + 5 < v.length; i += 6) {
    if (bundle.wavefrontVertexTimesM[i / 3] > timeM) continue;
    const a = projection.point(v[i], v[i + 1], v[i + 2]);
    const b = projection.point(v[i + 3], v[i + 4], v[i + 5]);
    if (a !== undefined && b !== undefined) segments.push([a.x, a.y, b.x, b.y]);
  }
  const stroke = (colour: string, widthPx: number) => {
    context.strokeStyle = colour;
    context.lineWidth = widthPx * s;
    context.lineCap = "round";
    context.beginPath();
    for (const [ax, ay, bx, by] of segments) {
      context.moveTo(ax, ay);
      context.lineTo(bx, by);
    }
    context.stroke();
  };
  stroke(PAPER, FRONT_EDGE_PX);
  stroke(sceneInks.wavefront.print.color, FRONT_PX);
}

/** The axis from the lens toward the distant observer (+x), with its head and label. */
function drawObserverAxis(context: CanvasRenderingContext2D, projection: FigureProjection, axisTipM: number, s: number) {
  const origin = projection.point(0, 0, 0);
  const tip = projection.point(axisTipM, 0, 0);
  if (origin === undefined || tip === undefined) return;
  context.strokeStyle = INK;
  context.fillStyle = INK;
  context.lineWidth = LINE_PX * s;
  context.beginPath();
  context.moveTo(origin.x, origin.y);
  context.lineTo(tip.x, tip.y);
  context.stroke();
  const lengthPx = Math.hypot(tip.x - origin.x, tip.y - origin.y);
  if (lengthPx > 10 * s) arrowHead(context, tip, Math.atan2(tip.y - origin.y, tip.x - origin.x), 8 * s);
  context.font = `${LABEL_FONT_PX * s}px ${plotFont}`;
  context.textAlign = "right";
  context.textBaseline = "bottom";
  haloText(context, OBSERVER_AXIS_LABEL, tip.x, tip.y - 8 * s, s);
}

/** The ramp's bar with its round values under it and its title above, from (left, top); returns its height. */
function drawRamp(context: CanvasRenderingContext2D, ramp: QuantityScale, left: number, top: number, s: number): number {
  const lineHeight = CAPTION_FONT_PX * 1.35 * s;
  context.fillStyle = INK;
  context.textAlign = "left";
  context.textBaseline = "top";
  context.fillText(ramp.title, left, top);
  const barTop = top + lineHeight;
  const width = RAMP_WIDTH_PX * s;
  const gradient = context.createLinearGradient(left, 0, left + width, 0);
  const stops = rampStops("print");
  stops.forEach((colour, k) => gradient.addColorStop(k / (stops.length - 1), colour));
  context.fillStyle = gradient;
  context.fillRect(left, barTop, width, RAMP_HEIGHT_PX * s);
  context.strokeStyle = INK;
  context.lineWidth = 0.75 * s;
  context.strokeRect(left, barTop, width, RAMP_HEIGHT_PX * s);
  context.fillStyle = INK;
  context.textAlign = "center";
  for (const tick of ramp.ticks) {
    const x = left + tick.fraction * width;
    context.beginPath();
    context.moveTo(x, barTop + RAMP_HEIGHT_PX * s);
    context.lineTo(x, barTop + (RAMP_HEIGHT_PX + 4) * s);
    context.stroke();
    context.fillText(tick.label, x, barTop + (RAMP_HEIGHT_PX + 5) * s);
  }
  return lineHeight + (RAMP_HEIGHT_PX + 5) * s + lineHeight;
}

function drawCaption(context: CanvasRenderingContext2D, lines: string[], key: FigureKeyEntry[], ramp: QuantityScale | undefined, top: number, width: number, s: number) {
  const left = MARGIN_PX * s;
  const lineHeight = CAPTION_FONT_PX * 1.35 * s;
  context.fillStyle = INK;
  context.textAlign = "left";
  context.textBaseline = "top";
  context.font = `${CAPTION_FONT_PX * s}px ${plotFont}`;
  lines.forEach((line, index) => context.fillText(line, left, top + index * lineHeight));
  let y = top + lines.length * lineHeight + lineHeight / 2;
  if (ramp !== undefined) y += drawRamp(context, ramp, left, y - lineHeight / 2 + 4 * s, s) + 4 * s;
  let x = left;
  context.textAlign = "left";
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

/** Height of the colour ramp's block in the caption band, CSS pixels (title, bar, values). */
const RAMP_BLOCK_PX = 2 * CAPTION_FONT_PX * 1.35 + RAMP_HEIGHT_PX + 5 + 8;

/** The figure as a new canvas: the view above, the caption and key below on the same white page. */
export function composeRayFigure(request: RayFigureRequest): HTMLCanvasElement {
  const { camera, scale, surfaceRadiusM, massSolar, caption, key, ramp, rings, axisTipM } = request;
  const s = scale;
  const width = request.widthPx * s;
  const height = request.heightPx * s;
  const figure = document.createElement("canvas");
  const measure = figure.getContext("2d")!;
  measure.font = `${CAPTION_FONT_PX * s}px ${plotFont}`;
  const captionLines = wrapText(measure, caption, width - 2 * MARGIN_PX * s);
  const bandPx = Math.ceil((MARGIN_PX + CAPTION_FONT_PX * 1.35 * (captionLines.length + 1) + (ramp === undefined ? 0 : RAMP_BLOCK_PX) + MARGIN_PX) * s);
  figure.width = width;
  figure.height = height + bandPx;
  const context = figure.getContext("2d")!;
  context.fillStyle = PAPER;
  context.fillRect(0, 0, figure.width, figure.height);

  const projection = new FigureProjection(camera, width, height);
  context.save();
  context.beginPath();
  context.rect(0, 0, width, height);
  context.clip();
  drawLens(context, projection, camera, surfaceRadiusM);
  drawRingLines(context, projection, rings, s);
  drawRays(context, request, projection, s);
  drawFronts(context, request, projection, s);
  drawObserverAxis(context, projection, axisTipM, s);
  drawRingLabels(context, projection, rings, s);
  const centre = toPixels(new THREE.Vector3(0, 0, 0), projection);
  const right = new THREE.Vector3().setFromMatrixColumn(camera.matrixWorld, 0).normalize();
  const rightPx = toPixels(right, projection);
  // Pixels per unit of M at the lens (the scale bar holds there; nearer or farther parts differ in perspective).
  const pxPerM = Math.hypot(rightPx.x - centre.x, rightPx.y - centre.y);
  if (pxPerM > 0) drawScaleBar(context, pxPerM, massSolar, width, height, s);
  context.restore();

  context.strokeStyle = INK;
  context.lineWidth = 0.75 * s;
  context.beginPath();
  context.moveTo(0, height + 0.5 * s);
  context.lineTo(figure.width, height + 0.5 * s);
  context.stroke();
  drawCaption(context, captionLines, key, ramp, height + MARGIN_PX * s, figure.width, s);
  return figure;
}
