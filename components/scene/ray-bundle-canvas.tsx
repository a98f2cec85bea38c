"use client";

import { OrbitControls } from "@react-three/drei";
import { Canvas } from "@react-three/fiber";
import { useCallback, useRef } from "react";
import type { AssembledBundle } from "@/lib/bench/assemble-bundle";
import { LensMass } from "./lens-mass";
import type { PngScale } from "./png-scale";
import { ProgressiveBundle } from "./progressive-bundle";

/** Vertical field of view, degrees. */
const FIELD_OF_VIEW_DEG = 45;

/** What the page may do with the view: a PNG of it, with any bundle still being drawn completed first. */
export interface RayBundleView {
  toPngDataUrl: (scale: PngScale) => string;
}

export interface RayBundleCanvasProps {
  bundle?: AssembledBundle;
  /** Radius the rays start from (units of M), which frames the view before any bundle exists. */
  startRadiusM: number;
  /** Radius of the lens's body (units of M) when it lies outside the photon sphere; 0 for a compact lens. */
  surfaceRadiusM: number;
  onViewReady: (view: RayBundleView) => void;
  /** Called once the first frame showing the whole of `bundle` has been rendered. */
  onBundleDrawn: (bundle: AssembledBundle) => void;
}

/** Frames the traced region: the camera looks down the z axis, face-on to the fan's plane. */
function cameraDistance(startRadiusM: number): number {
  // Rays span x in ±R and, with b up to R/2 plus their bending, y in about ±0.65 R.
  return (0.65 * startRadiusM) / Math.tan(((FIELD_OF_VIEW_DEG / 2) * Math.PI) / 180);
}

/** The 3D ray-bundle view (client only: loaded with next/dynamic and ssr: false). */
export default function RayBundleCanvas({ bundle, startRadiusM, surfaceRadiusM, onViewReady, onBundleDrawn }: RayBundleCanvasProps) {
  const distance = cameraDistance(bundle?.startRadiusM ?? startRadiusM);
  const drawRemaining = useRef<() => void>(() => {});
  const onDrawRemaining = useCallback((draw: () => void) => {
    drawRemaining.current = draw;
  }, []);
  return (
    <Canvas
      frameloop="demand"
      dpr={1}
      camera={{ position: [0, 0, distance], fov: FIELD_OF_VIEW_DEG, near: 0.1, far: 20 * distance }}
      // The drawing buffer is kept between frames: the bundle is drawn onto it over several frames,
      // and a PNG is read from it. No MSAA: software rendering multiplied the draw time by about 3.5.
      gl={{ preserveDrawingBuffer: true, antialias: false }}
      onCreated={({ gl }) =>
        onViewReady({
          toPngDataUrl: (scale) => {
            // A larger drawing buffer for the snapshot only: the bundle is redrawn into it at once
            // (one long task, on the user's click), read out, and the view goes back to screen size.
            const screenRatio = gl.getPixelRatio();
            if (scale !== screenRatio) gl.setPixelRatio(scale);
            drawRemaining.current();
            const dataUrl = gl.domElement.toDataURL("image/png");
            if (scale !== screenRatio) {
              gl.setPixelRatio(screenRatio);
              drawRemaining.current();
            }
            return dataUrl;
          },
        })
      }
      data-testid="ray-bundle-canvas"
    >
      <color attach="background" args={["#05070c"]} />
      <LensMass surfaceRadiusM={surfaceRadiusM} />
      {bundle !== undefined ? <ProgressiveBundle bundle={bundle} onBundleDrawn={onBundleDrawn} onDrawRemaining={onDrawRemaining} /> : null}
      <OrbitControls makeDefault enableDamping={false} />
    </Canvas>
  );
}
