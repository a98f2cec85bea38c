"use client";

import { OrbitControls } from "@react-three/drei";
import { Canvas, type RootState } from "@react-three/fiber";
import { useCallback, useRef } from "react";
import type { AssembledBundle } from "@/lib/bench/assemble-bundle";
import { LensMass } from "./lens-mass";
import type { PngScale } from "./png-scale";
import { ProgressiveBundle } from "./progressive-bundle";
import { composeRayFigure, type RayFigureLabels } from "./ray-figure";
import { sceneBackground } from "./scene-colours";
import { applyInk } from "./scene-ink";

/** Vertical field of view, degrees. */
const FIELD_OF_VIEW_DEG = 45;

/** What the page may do with the view: a figure of it (PNG data URL), with the whole bundle drawn. */
export interface RayBundleView {
  toFigurePngDataUrl: (scale: PngScale, labels: RayFigureLabels) => string;
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
  const drawWhole = useRef<(() => void) | undefined>(undefined);
  const onDrawWhole = useCallback((draw: (() => void) | undefined) => {
    drawWhole.current = draw;
  }, []);
  return (
    <Canvas
      frameloop="demand"
      dpr={1}
      camera={{ position: [0, 0, distance], fov: FIELD_OF_VIEW_DEG, near: 0.1, far: 20 * distance }}
      // The drawing buffer is kept between frames: the bundle is drawn onto it over several frames,
      // and a PNG is read from it. No MSAA: software rendering multiplied the draw time by about 3.5.
      gl={{ preserveDrawingBuffer: true, antialias: false }}
      onCreated={({ get }: RootState) =>
        onViewReady({
          toFigurePngDataUrl: (scale, labels) => {
            const { gl, scene, camera } = get();
            const redraw = () => (drawWhole.current ?? (() => gl.render(scene, camera)))();
            // The figure is drawn in print ink into a drawing buffer `scale` times the screen's (one
            // long task, on the user's click), read out, and the view goes back to the screen's ink and size.
            const screenRatio = gl.getPixelRatio();
            gl.setPixelRatio(scale);
            applyInk(scene, "print");
            redraw();
            const figure = composeRayFigure({ view: gl.domElement, camera, scale, ...labels });
            gl.setPixelRatio(screenRatio);
            applyInk(scene, "screen");
            redraw();
            return figure.toDataURL("image/png");
          },
        })
      }
      data-testid="ray-bundle-canvas"
    >
      <color attach="background" args={[sceneBackground.screen]} />
      <LensMass surfaceRadiusM={surfaceRadiusM} />
      {bundle !== undefined ? <ProgressiveBundle bundle={bundle} onBundleDrawn={onBundleDrawn} onDrawWhole={onDrawWhole} /> : null}
      <OrbitControls makeDefault enableDamping={false} />
    </Canvas>
  );
}
