"use client";

import { useFrame, useThree, type RootState } from "@react-three/fiber";
import { useCallback, useEffect, useMemo, useRef } from "react";
import type * as THREE from "three";
import type { AssembledBundle } from "@/lib/bench/assemble-bundle";
import { progressiveFrames } from "@/lib/bench/progressive-draw";
import { RayBundleLines, WavefrontLines } from "./ray-bundle-lines";

/** Camera world matrix, projection matrix and drawing-buffer size: what a drawn picture depends on. */
const VIEW_KEY_LENGTH = 16 + 16 + 2;

export interface ProgressiveBundleProps {
  bundle: AssembledBundle;
  /** Called once, after the frame that first completes `bundle` has been rendered. */
  onBundleDrawn: (bundle: AssembledBundle) => void;
  /** Receives a function that draws whatever is left of the bundle at once (for saving the view). */
  onDrawRemaining: (drawRemaining: () => void) => void;
}

/**
 * Draws the bundle over several frames onto the preserved drawing buffer (see progressive-draw): the
 * first frame clears and draws the scene without the bundle plus the first share of the rays, each
 * later frame adds one share without clearing, the last adds the wavefronts. A change of view or of
 * bundle starts again from the first frame. Takes over rendering from the canvas (useFrame priority 1).
 */
export function ProgressiveBundle({ bundle, onBundleDrawn, onDrawRemaining }: ProgressiveBundleProps) {
  const rays = useRef<THREE.LineSegments>(null);
  const fronts = useRef<THREE.LineSegments>(null);
  const frames = useMemo(() => progressiveFrames(bundle.fateGroups), [bundle]);
  const progress = useRef({
    bundle: undefined as AssembledBundle | undefined,
    frame: 0,
    view: new Float64Array(VIEW_KEY_LENGTH),
    // Redrawing after a turn of the view is not news: only the first completion is reported.
    reported: undefined as AssembledBundle | undefined,
  });
  const reportDrawn = useRef(onBundleDrawn);
  useEffect(() => {
    reportDrawn.current = onBundleDrawn;
  }, [onBundleDrawn]);

  /** Draws the next frame's share; false once the whole bundle is on the buffer. */
  const drawStep = useCallback(
    ({ gl, scene, camera }: Pick<RootState, "gl" | "scene" | "camera">): boolean => {
      const raysObject = rays.current;
      const frontsObject = fronts.current;
      if (raysObject === null || frontsObject === null) return false;
      const state = progress.current;
      if (state.bundle !== bundle || viewChanged(state.view, camera, gl.domElement)) {
        state.bundle = bundle;
        state.frame = 0;
      }
      if (state.frame >= frames.length) return false;
      const autoClear = gl.autoClear;
      if (state.frame === 0) {
        raysObject.visible = false;
        frontsObject.visible = false;
        gl.render(scene, camera);
      }
      gl.autoClear = false;
      raysObject.visible = true;
      raysObject.geometry.groups = frames[state.frame];
      gl.render(raysObject, camera);
      state.frame += 1;
      const done = state.frame === frames.length;
      if (done) {
        frontsObject.visible = true;
        gl.render(frontsObject, camera);
      }
      gl.autoClear = autoClear;
      if (done && state.reported !== bundle) {
        state.reported = bundle;
        reportDrawn.current(bundle);
      }
      return !done;
    },
    [bundle, frames],
  );

  useFrame((state) => {
    if (drawStep(state)) state.invalidate();
  }, 1);

  const getState = useThree((state) => state.get);
  const invalidate = useThree((state) => state.invalidate);
  useEffect(() => {
    invalidate();
    onDrawRemaining(() => {
      while (drawStep(getState()));
    });
    return () => onDrawRemaining(() => {});
  }, [drawStep, getState, invalidate, onDrawRemaining]);

  return (
    <>
      <RayBundleLines ref={rays} bundle={bundle} />
      <WavefrontLines ref={fronts} vertices={bundle.wavefrontVertices} />
    </>
  );
}

/** Whether the view differs from the one recorded in `key`; records the current one. */
function viewChanged(key: Float64Array, camera: THREE.Camera, canvas: HTMLCanvasElement): boolean {
  camera.updateMatrixWorld();
  const current = [...camera.matrixWorld.elements, ...camera.projectionMatrix.elements, canvas.width, canvas.height];
  let changed = false;
  for (let i = 0; i < VIEW_KEY_LENGTH; i++) {
    if (key[i] !== current[i]) changed = true;
    key[i] = current[i];
  }
  return changed;
}
