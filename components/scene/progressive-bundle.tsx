"use client";

import { useFrame, useThree, type RootState } from "@react-three/fiber";
import { useCallback, useEffect, useMemo, useRef, type RefObject } from "react";
import * as THREE from "three";
import type { AssembledBundle } from "@/lib/ray-view/assemble-bundle";
import { FIRST_FRAME_SEGMENTS, UPLOAD_FRAME_SEGMENTS, nextFrameSegments, segmentTotal, shareOfGroups } from "@/lib/ray-view/progressive-draw";
import { RayBundleLines, WavefrontLines, type RayViewUniforms, type WavefrontPassUniforms } from "./ray-bundle-lines";
import { sceneBackground, sceneInks } from "./scene-colours";

/** Camera world matrix, projection matrix and drawing-buffer size: what a drawn picture depends on. */
const VIEW_KEY_LENGTH = 16 + 16 + 2;

/**
 * The wavefronts' edge: passes shifted by these offsets (drawing-buffer pixels) in the ground's
 * colour, then the front itself, so a front reads as a line of its own across bright, dense rays.
 */
const FRONT_EDGE_OFFSETS_PX: readonly [number, number][] = [
  [1, 0],
  [-1, 0],
  [0, 1],
  [0, -1],
];

// The fronts' shader writes its colour as given (no colour-space conversion), so the hex values are
// taken as they are rather than converted to linear light.
const FRONT_EDGE_COLOUR = new THREE.Color().setStyle(sceneBackground.screen, THREE.LinearSRGBColorSpace);
const FRONT_COLOUR = new THREE.Color().setStyle(sceneInks.wavefront.screen.color, THREE.LinearSRGBColorSpace);

export interface ProgressiveBundleProps {
  bundle: AssembledBundle;
  /** Each vertex's colour, [r, g, b] 0–255; undefined: each fate's own. */
  colours: Uint8Array | undefined;
  uniforms: RayViewUniforms;
  /** Raised by the view when a uniform changes (the time slider): the picture is drawn again. */
  revision: RefObject<number>;
  /** Called once, after the frame that first completes `bundle` has been rendered. */
  onBundleDrawn: (bundle: AssembledBundle) => void;
}

/**
 * Draws the bundle over several frames onto the preserved drawing buffer (see progressive-draw): the
 * first frame clears and draws the scene without the bundle plus the first share of the rays, each
 * later frame adds one share without clearing, the last adds the wavefronts. Each share's size is
 * steered by how long the frame before took. A change of view, of bundle, of its colours or of the
 * time slider starts again from the first frame. Takes over rendering from the canvas (useFrame priority 1).
 */
export function ProgressiveBundle({ bundle, colours, uniforms, revision, onBundleDrawn }: ProgressiveBundleProps) {
  const rays = useRef<THREE.LineSegments>(null);
  const fronts = useRef<THREE.LineSegments>(null);
  const totalSegments = useMemo(() => segmentTotal(bundle.fateGroups), [bundle]);
  const progress = useRef({
    bundle: undefined as AssembledBundle | undefined,
    colours: undefined as Uint8Array | undefined,
    revision: 0,
    /** Segments on the buffer; undefined until the frame that clears it has been drawn. */
    drawnSegments: undefined as number | undefined,
    view: new Float64Array(VIEW_KEY_LENGTH),
    // Redrawing after a turn of the view is not news: only the first completion is reported.
    reported: undefined as AssembledBundle | undefined,
    // The share is kept from bundle to bundle: what the machine managed last time is the best guess.
    frameSegments: FIRST_FRAME_SEGMENTS,
    /** The frame being timed: when it started (performance.now(), ms), the segments it drew, and its cost once known. */
    timed: undefined as { startedAtMs: number; segments: number; costMs?: number } | undefined,
  });
  // A message posted during a frame is handled once that frame's task is over (rendering and, under
  // software WebGL, the compositor's wait for the GPU): its arrival closes the frame's cost.
  const taskEndPort = useRef<MessagePort | undefined>(undefined);
  useEffect(() => {
    const channel = new MessageChannel();
    channel.port1.onmessage = () => {
      const timed = progress.current.timed;
      if (timed !== undefined && timed.costMs === undefined) timed.costMs = performance.now() - timed.startedAtMs;
    };
    taskEndPort.current = channel.port2;
    return () => {
      channel.port1.close();
      taskEndPort.current = undefined;
    };
  }, []);
  const reportDrawn = useRef(onBundleDrawn);
  useEffect(() => {
    reportDrawn.current = onBundleDrawn;
  }, [onBundleDrawn]);

  /** Draws up to `segments` more of the bundle; false once the whole bundle is on the buffer. */
  const drawStep = useCallback(
    ({ gl, scene, camera }: Pick<RootState, "gl" | "scene" | "camera">, segments: number): boolean => {
      const raysObject = rays.current;
      const frontsObject = fronts.current;
      if (raysObject === null || frontsObject === null) return false;
      const state = progress.current;
      if (state.bundle !== bundle || state.colours !== colours || state.revision !== revision.current || viewChanged(state.view, camera, gl.domElement)) {
        state.bundle = bundle;
        state.colours = colours;
        state.revision = revision.current;
        state.drawnSegments = undefined;
      }
      if (state.drawnSegments === totalSegments) return false;
      const autoClear = gl.autoClear;
      if (state.drawnSegments === undefined) {
        raysObject.visible = false;
        frontsObject.visible = false;
        gl.render(scene, camera);
      }
      gl.autoClear = false;
      raysObject.visible = true;
      const from = state.drawnSegments ?? 0;
      const to = Math.min(totalSegments, from + segments);
      raysObject.geometry.groups = shareOfGroups(bundle.fateGroups, from, to, totalSegments);
      gl.render(raysObject, camera);
      state.drawnSegments = to;
      const done = to === totalSegments;
      if (done) {
        frontsObject.visible = true;
        drawFronts(gl, frontsObject, camera);
      }
      gl.autoClear = autoClear;
      if (done && state.reported !== bundle) {
        state.reported = bundle;
        reportDrawn.current(bundle);
      }
      return !done;
    },
    [bundle, colours, revision, totalSegments],
  );

  useFrame((rootState) => {
    const state = progress.current;
    const startedAtMs = performance.now();
    const timed = state.timed;
    // Without the message (not delivered yet), the interval since the timed frame bounds its cost.
    if (timed !== undefined) state.frameSegments = nextFrameSegments(timed.segments, timed.costMs ?? startedAtMs - timed.startedAtMs);
    const isUploadFrame = state.bundle !== bundle;
    const isDrawing = drawStep(rootState, isUploadFrame ? UPLOAD_FRAME_SEGMENTS : state.frameSegments);
    // Sent now, the frame's GL commands run in the GPU process while the page is painted, not after.
    rootState.gl.getContext().flush();
    state.timed = isDrawing && !isUploadFrame ? { startedAtMs, segments: state.frameSegments } : undefined;
    if (isDrawing) {
      taskEndPort.current?.postMessage(null);
      rootState.invalidate();
    }
  }, 1);

  const invalidate = useThree((state) => state.invalidate);
  useEffect(() => invalidate(), [drawStep, invalidate]);

  return (
    <>
      <RayBundleLines ref={rays} bundle={bundle} colours={colours} uniforms={uniforms} />
      <WavefrontLines ref={fronts} vertices={bundle.wavefrontVertices} timesM={bundle.wavefrontVertexTimesM} uniforms={uniforms} />
    </>
  );
}

/** The wavefronts: their dark edge (shifted passes), then the fronts over it. */
function drawFronts(gl: THREE.WebGLRenderer, fronts: THREE.LineSegments, camera: THREE.Camera) {
  const material = fronts.material as THREE.ShaderMaterial;
  const passUniforms = material.uniforms as unknown as WavefrontPassUniforms;
  gl.getDrawingBufferSize(passUniforms.uViewportPx.value);
  const pass = (offset: readonly [number, number], colour: THREE.Color) => {
    passUniforms.uOffsetPx.value.set(offset[0], offset[1]);
    passUniforms.uColour.value.copy(colour);
    material.uniformsNeedUpdate = true;
    gl.render(fronts, camera);
  };
  for (const offset of FRONT_EDGE_OFFSETS_PX) pass(offset, FRONT_EDGE_COLOUR);
  pass([0, 0], FRONT_COLOUR);
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
