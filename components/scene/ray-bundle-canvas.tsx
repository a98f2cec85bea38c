"use client";

import { OrbitControls } from "@react-three/drei";
import { addAfterEffect, Canvas, useThree } from "@react-three/fiber";
import { useEffect, useRef } from "react";
import type { AssembledBundle } from "@/lib/bench/assemble-bundle";
import { LensMass } from "./lens-mass";
import { RayBundleLines, WavefrontLines } from "./ray-bundle-lines";

/** Vertical field of view, degrees. */
const FIELD_OF_VIEW_DEG = 45;

export interface RayBundleCanvasProps {
  bundle?: AssembledBundle;
  /** Radius the rays start from (units of M), which frames the view before any bundle exists. */
  startRadiusM: number;
  /** The canvas element, for saving the view as PNG. */
  onCanvasReady: (canvas: HTMLCanvasElement) => void;
  /** Called once the first frame showing `bundle` has been rendered. */
  onBundleDrawn: (bundle: AssembledBundle) => void;
}

/** Reports, after the renderer has drawn a frame, which bundle that frame showed. */
function DrawnSignal({ bundle, onBundleDrawn }: { bundle?: AssembledBundle; onBundleDrawn: (bundle: AssembledBundle) => void }) {
  const invalidate = useThree((state) => state.invalidate);
  const pending = useRef<AssembledBundle | undefined>(undefined);
  const callback = useRef(onBundleDrawn);
  useEffect(() => {
    callback.current = onBundleDrawn;
  }, [onBundleDrawn]);
  useEffect(() => {
    pending.current = bundle;
    invalidate();
  }, [bundle, invalidate]);
  useEffect(
    () =>
      addAfterEffect(() => {
        const drawn = pending.current;
        if (drawn === undefined) return;
        pending.current = undefined;
        callback.current(drawn);
      }),
    [],
  );
  return null;
}

/** Frames the traced region: the camera looks down the z axis, face-on to the fan's plane. */
function cameraDistance(startRadiusM: number): number {
  // Rays span x in ±R and, with b up to R/2 plus their bending, y in about ±0.65 R.
  return (0.65 * startRadiusM) / Math.tan(((FIELD_OF_VIEW_DEG / 2) * Math.PI) / 180);
}

/** The 3D ray-bundle view (client only: loaded with next/dynamic and ssr: false). */
export default function RayBundleCanvas({ bundle, startRadiusM, onCanvasReady, onBundleDrawn }: RayBundleCanvasProps) {
  const distance = cameraDistance(bundle?.startRadiusM ?? startRadiusM);
  return (
    <Canvas
      frameloop="demand"
      dpr={1}
      camera={{ position: [0, 0, distance], fov: FIELD_OF_VIEW_DEG, near: 0.1, far: 20 * distance }}
      gl={{ preserveDrawingBuffer: true, antialias: false }}
      onCreated={({ gl }) => onCanvasReady(gl.domElement)}
      data-testid="ray-bundle-canvas"
    >
      <color attach="background" args={["#05070c"]} />
      <LensMass />
      {bundle !== undefined ? (
        <>
          <RayBundleLines bundle={bundle} />
          <WavefrontLines vertices={bundle.wavefrontVertices} />
        </>
      ) : null}
      <OrbitControls makeDefault enableDamping={false} />
      <DrawnSignal bundle={bundle} onBundleDrawn={onBundleDrawn} />
    </Canvas>
  );
}
