"use client";

import { releaseProxy, transfer, wrap, type Remote } from "comlink";
import { useEffect, useRef, useState } from "react";
import { PerspectiveCamera } from "three";
import { OrbitControls } from "three/examples/jsm/controls/OrbitControls.js";
import type { AssembledBundle } from "@/lib/bench/assemble-bundle";
import type { RayViewWorkerApi } from "@/workers/ray-trace-view.worker";
import type { PngScale } from "./png-scale";
import type { CameraPose, ViewSize } from "./ray-view-scene";

/** Vertical field of view, degrees. */
const FIELD_OF_VIEW_DEG = 45;

/** What the page may do with the view: a PNG of it, with any bundle still being drawn completed first. */
export interface RayBundleView {
  toPngDataUrl: (scale: PngScale) => Promise<string>;
}

export interface RayBundleCanvasProps {
  bundle?: AssembledBundle;
  /** Radius the rays start from (units of M), which frames the view before any bundle exists. */
  startRadiusM: number;
  onViewReady: (view: RayBundleView) => void;
  /** Called once the first frame showing the whole of `bundle` has been rendered. */
  onBundleDrawn: (bundle: AssembledBundle) => void;
}

/** Frames the traced region: the camera looks down the z axis, face-on to the fan's plane. */
function cameraDistance(startRadiusM: number): number {
  // Rays span x in ±R and, with b up to R/2 plus their bending, y in about ±0.65 R.
  return (0.65 * startRadiusM) / Math.tan(((FIELD_OF_VIEW_DEG / 2) * Math.PI) / 180);
}

function poseOf(camera: PerspectiveCamera): CameraPose {
  return { position: camera.position.toArray(), quaternion: camera.quaternion.toArray() as CameraPose["quaternion"] };
}

function sizeOf(element: HTMLElement): ViewSize {
  const { width, height } = element.getBoundingClientRect();
  return { widthPx: width, heightPx: height };
}

/**
 * The 3D ray-bundle view (client only: loaded with next/dynamic and ssr: false). The picture is drawn
 * in a worker (workers/ray-trace-view.worker) on this canvas handed over as an OffscreenCanvas; the
 * page keeps the orbit controls and the camera, and sends the camera's pose when it moves.
 */
export default function RayBundleCanvas({ bundle, startRadiusM, onViewReady, onBundleDrawn }: RayBundleCanvasProps) {
  const host = useRef<HTMLDivElement>(null);
  const view = useRef<Remote<RayViewWorkerApi> | undefined>(undefined);
  const [error, setError] = useState<string | undefined>(undefined);
  const latest = useRef({ bundle, startRadiusM, onViewReady, onBundleDrawn });
  useEffect(() => {
    latest.current = { bundle, startRadiusM, onViewReady, onBundleDrawn };
  }, [bundle, startRadiusM, onViewReady, onBundleDrawn]);

  useEffect(() => {
    const element = host.current;
    if (element === null) return;
    // A canvas of its own for each start: a canvas hands its control to one OffscreenCanvas only once.
    const canvas = document.createElement("canvas");
    canvas.className = "block h-full w-full";
    element.append(canvas);
    if (typeof canvas.transferControlToOffscreen !== "function") {
      setError("This browser cannot draw the 3D view (it needs OffscreenCanvas).");
      return () => canvas.remove();
    }
    const worker = new Worker(new URL("../../workers/ray-trace-view.worker.ts", import.meta.url), { type: "module", name: "ray-trace-view" });
    const remote = wrap<RayViewWorkerApi>(worker);
    const size = sizeOf(element);
    const distance = cameraDistance(latest.current.bundle?.startRadiusM ?? latest.current.startRadiusM);
    const camera = new PerspectiveCamera(FIELD_OF_VIEW_DEG, size.widthPx / Math.max(1, size.heightPx), 0.1, 20 * distance);
    camera.position.set(0, 0, distance);
    const controls = new OrbitControls(camera, canvas);
    const offscreen = canvas.transferControlToOffscreen();
    const fail = (reason: unknown) => setError(reason instanceof Error ? reason.message : String(reason));
    remote.start(transfer({ canvas: offscreen, size, camera: { fovDeg: camera.fov, near: camera.near, far: camera.far }, pose: poseOf(camera) }, [offscreen])).catch(fail);
    controls.addEventListener("change", () => remote.moveCamera(poseOf(camera)).catch(fail));
    const resizes = new ResizeObserver(() => {
      const next = sizeOf(element);
      camera.aspect = next.widthPx / Math.max(1, next.heightPx);
      camera.updateProjectionMatrix();
      remote.resize(next).catch(fail);
    });
    resizes.observe(element);
    view.current = remote;
    latest.current.onViewReady({ toPngDataUrl: (scale) => remote.pngDataUrl(scale) });
    return () => {
      view.current = undefined;
      resizes.disconnect();
      controls.dispose();
      remote[releaseProxy]();
      worker.terminate();
      canvas.remove();
    };
  }, []);

  useEffect(() => {
    const remote = view.current;
    if (bundle === undefined || remote === undefined) return;
    let isCurrent = true;
    remote
      .showBundle(bundle)
      .then((drawn) => {
        if (drawn && isCurrent) latest.current.onBundleDrawn(bundle);
      })
      .catch((reason: unknown) => setError(reason instanceof Error ? reason.message : String(reason)));
    return () => {
      isCurrent = false;
    };
  }, [bundle]);

  return (
    <div ref={host} className="relative h-full w-full" data-testid="ray-bundle-canvas">
      {error !== undefined ? (
        <p role="alert" className="absolute inset-x-0 top-0 p-4 text-sm text-alarm">
          The 3D view failed: {error}
        </p>
      ) : null}
    </div>
  );
}
