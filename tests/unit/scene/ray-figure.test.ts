import * as THREE from "three";
import { afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { assembleBundle, RAY_FATES, type AssembledBundle } from "@/lib/ray-view/assemble-bundle";
import { bundleLayout } from "@/lib/ray-view/bundle-layout";
import { arrivalTimes, drawnRays, wavefrontPoints } from "@/lib/ray-view/bundle-vertices";
import { rayColours } from "@/lib/ray-view/colour";
import { defaultViewDirection, extentOf, frameExtent } from "@/lib/ray-view/frame";
import { observerAxisTipM, OBSERVER_AXIS_LABEL, scaleRings } from "@/lib/ray-view/scale";
import { traceRayBundle } from "@/lib/physics";
import { fateStyles } from "@/components/scene/fate-styles";
import { composeRayFigure } from "@/components/scene/ray-figure";

/** What the figure asked of its 2D context: each stroke with the line width and alpha then set, each text with its font. */
interface Recorded {
  strokes: { lineWidth: number; alpha: number; points: number }[];
  texts: { text: string; font: string }[];
}

/**
 * A stand-in for the browser's 2D canvas (node has none): it keeps the state the figure sets and
 * records strokes and texts, so the figure's sizes can be read without drawing.
 */
function recordingCanvas(recorded: Recorded) {
  let points = 0;
  const context = {
    lineWidth: 1,
    globalAlpha: 1,
    font: "10px sans-serif",
    measureText: (text: string) => ({ width: text.length * 6 }),
    createLinearGradient: () => ({ addColorStop: () => undefined }),
    beginPath: () => (points = 0),
    moveTo: () => (points += 1),
    lineTo: () => (points += 1),
    stroke: () => recorded.strokes.push({ lineWidth: context.lineWidth, alpha: context.globalAlpha, points }),
    fillText: (text: string) => recorded.texts.push({ text, font: context.font }),
  };
  const ignored = new Proxy(context as Record<string, unknown>, { get: (target, name: string) => (name in target ? target[name] : () => undefined) });
  return { width: 0, height: 0, getContext: () => ignored, toDataURL: () => "data:image/png;base64," };
}

let bundle: AssembledBundle;
let camera: THREE.PerspectiveCamera;
const WIDTH_PX = 600;
const HEIGHT_PX = 300;

beforeAll(() => {
  // 60 rays with b up to 100 M, traced and assembled as the workers do.
  const layout = bundleLayout({ rayCount: 60, bMinM: 0.5, bMaxM: 100, layout: "fan" });
  const traced = traceRayBundle(layout.impactParametersM, 1, { samples: layout.samples, startRadius: layout.startRadiusM, rtol: 1e-7 });
  const chunk = {
    firstRay: 0,
    rayCount: 60,
    ...drawnRays(traced.xy, traced.t, 60, layout.samples, layout.azimuthsRad),
    fates: traced.fates,
    deflectionsRad: Float32Array.from(traced.deflections),
    arrivalTimesM: arrivalTimes(traced.t, traced.fates, layout.samples),
    wavefronts: wavefrontPoints(traced.xy, traced.t, 60, layout.samples, layout.azimuthsRad, layout.wavefrontTimesM),
  };
  bundle = assembleBundle([chunk], 60, layout.planes, layout.wavefrontTimesM, layout.startRadiusM);
  const extent = extentOf(new Float32Array([observerAxisTipM(bundle.extentM.max[0]), 0, 0]), bundle.extentM);
  const frame = frameExtent(extent, defaultViewDirection(2), 45, WIDTH_PX / HEIGHT_PX);
  camera = new THREE.PerspectiveCamera(45, WIDTH_PX / HEIGHT_PX, frame.nearM, frame.farM);
  camera.position.set(...frame.position);
  camera.lookAt(...frame.target);
  camera.updateMatrixWorld();
});

afterEach(() => {
  vi.unstubAllGlobals();
});

function drawFigure(scale: 1 | 2 | 4, timeM = Number.POSITIVE_INFINITY): { recorded: Recorded; figure: { width: number; height: number } } {
  const recorded: Recorded = { strokes: [], texts: [] };
  const canvas = recordingCanvas(recorded);
  vi.stubGlobal("document", { createElement: () => canvas });
  const colours = rayColours(bundle.rayFates, undefined, undefined, "print", RAY_FATES.map((fate) => fateStyles[fate].print.color), "#4d4d4d");
  composeRayFigure({
    surfaceRadiusM: 0,
    massSolar: 0.5,
    caption: "A caption",
    key: [],
    ramp: undefined,
    widthPx: WIDTH_PX,
    heightPx: HEIGHT_PX,
    camera,
    scale,
    bundle,
    rayColours: colours,
    timeM,
    headM: 0,
    rings: scaleRings(bundle.startRadiusM, 0, 0.5),
    axisTipM: observerAxisTipM(bundle.extentM.max[0]),
  });
  return { recorded, figure: canvas };
}

describe("the saved figure of the ray view", () => {
  it("is the view's size times the scale, with a caption band below", () => {
    for (const scale of [1, 2, 4] as const) {
      const { figure } = drawFigure(scale);
      expect(figure.width).toBe(WIDTH_PX * scale);
      expect(figure.height).toBeGreaterThan(HEIGHT_PX * scale);
    }
  });

  it("draws its rays and labels at widths and sizes times the scale, not 1-px lines at 4×", () => {
    const one = drawFigure(1).recorded;
    const four = drawFigure(4).recorded;
    expect(four.strokes).toHaveLength(one.strokes.length);
    // Every stroke (rays, fronts, rings, axis, scale bar) is four times as wide.
    four.strokes.forEach((stroke, k) => expect(stroke.lineWidth).toBeCloseTo(4 * one.strokes[k].lineWidth, 9));
    expect(Math.min(...four.strokes.map((stroke) => stroke.lineWidth))).toBeGreaterThanOrEqual(3);
    const fontPx = (font: string) => Number(/^([\d.]+)px/.exec(font)?.[1]);
    four.texts.forEach((text, k) => expect(fontPx(text.font)).toBeCloseTo(4 * fontPx(one.texts[k].font), 9));
  });

  it("labels the rings in M and km for the mass, the axis toward the observer and the scale bar", () => {
    const texts = drawFigure(2).recorded.texts.map((text) => text.text);
    // 0.5 M☉: GM/c² = 738.3 m (IAU 2015 B3 nominal GM☉): 50 M = 36.92 km.
    expect(texts).toEqual(expect.arrayContaining(["horizon, r = 2 M = 1.477 km", "photon sphere, r = 3 M = 2.215 km", "50 M = 36.92 km", OBSERVER_AXIS_LABEL, "A caption"]));
    expect(texts.some((text) => /^\d+ M$/.test(text))).toBe(true); // the scale bar's length
  });

  it("draws the rays only as far as they have travelled at the time slider's time", () => {
    const pointsOf = (recorded: Recorded) => recorded.strokes.reduce((sum, stroke) => sum + stroke.points, 0);
    const whole = pointsOf(drawFigure(1).recorded);
    const early = pointsOf(drawFigure(1, bundle.latestTimeM / 4).recorded);
    expect(early).toBeLessThan(0.7 * whole);
    expect(early).toBeGreaterThan(0);
  });
});
