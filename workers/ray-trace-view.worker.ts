/// <reference lib="webworker" />
/**
 * Ray-view worker: draws the 3D ray bundle (components/scene/ray-view-scene) on the page's canvas,
 * handed over as an OffscreenCanvas. Drawing here rather than on the page keeps the page responsive:
 * under software compositing, Chromium reads a WebGL canvas back at every frame it shows, on the
 * thread that draws it, and so waits there for all the frame's GPU work (tasks of 50-200 ms on the
 * page's thread on the 2-core test machine under load). The page moves the camera and resizes; this
 * worker draws one step of the progressive drawing per animation frame.
 */

import { expose } from "comlink";
import type { AssembledBundle } from "@/lib/bench/assemble-bundle";
import { RayViewScene, type CameraPose, type ViewCamera, type ViewSize } from "@/components/scene/ray-view-scene";

export interface ViewStart {
  canvas: OffscreenCanvas;
  size: ViewSize;
  camera: ViewCamera;
  pose: CameraPose;
}

let canvas: OffscreenCanvas | undefined;
let scene: RayViewScene | undefined;
let frameRequested = false;
/** Reports the bundle last asked for: its first complete drawing (true) or its replacement (false). */
let reportDrawn: ((drawn: boolean) => void) | undefined;

function requestFrame(): void {
  if (frameRequested) return;
  frameRequested = true;
  requestAnimationFrame(drawFrame);
}

function drawFrame(): void {
  frameRequested = false;
  if (scene === undefined || !scene.drawStep()) return;
  reportIfDrawn();
  if (!scene.isComplete()) requestFrame();
}

/** Reports the bundle awaited once its picture is complete and rasterized. */
function reportIfDrawn(): void {
  if (scene === undefined || reportDrawn === undefined || !scene.isComplete()) return;
  scene.finishDrawing();
  reportDrawn(true);
  reportDrawn = undefined;
}

function started(): RayViewScene {
  if (scene === undefined) throw new Error("the ray view was not started");
  return scene;
}

const rayViewWorker = {
  start(request: ViewStart): void {
    canvas = request.canvas;
    scene = new RayViewScene(request.canvas, request.size, request.camera, request.pose);
    requestFrame();
  },

  resize(size: ViewSize): void {
    started().setSize(size);
    requestFrame();
  },

  moveCamera(pose: CameraPose): void {
    started().setPose(pose);
    requestFrame();
  },

  /** Shows `bundle`; resolves true once it is first drawn whole, false if another bundle replaces it first. */
  showBundle(bundle: AssembledBundle): Promise<boolean> {
    started().setBundle(bundle);
    reportDrawn?.(false);
    const drawn = new Promise<boolean>((report) => (reportDrawn = report));
    requestFrame();
    return drawn;
  },

  /** The complete view as a `data:image/png;base64,` URL, at `scale` times its screen size. */
  async pngDataUrl(scale: number): Promise<string> {
    if (canvas === undefined) throw new Error("the ray view was not started");
    const png = started().pngAtScale(canvas, scale);
    reportIfDrawn();
    return new FileReaderSync().readAsDataURL(await png);
  },
};

export type RayViewWorkerApi = typeof rayViewWorker;

expose(rayViewWorker);
