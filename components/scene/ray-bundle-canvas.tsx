"use client";

import { OrbitControls } from "@react-three/drei";
import { Canvas, useFrame, useThree, type RootState } from "@react-three/fiber";
import { useCallback, useEffect, useMemo, useRef, type ComponentRef, type RefObject } from "react";
import * as THREE from "three";
import { RAY_FATES, type AssembledBundle } from "@/lib/ray-view/assemble-bundle";
import { densityOpacity, rayColours, vertexColours, type QuantityScale, type RampInk } from "@/lib/ray-view/colour";
import { defaultViewDirection, extentOf, frameExtent, reframeDirection, type Extent, type Vec3 } from "@/lib/ray-view/frame";
import { observerAxisTipM, scaleRings } from "@/lib/ray-view/scale";
import { frontHeadM, sliderTimeM, TIME_SLIDER_STEPS } from "@/lib/ray-view/time";
import { fateStyles } from "./fate-styles";
import { LensMass } from "./lens-mass";
import type { PngScale } from "./png-scale";
import { ProgressiveBundle } from "./progressive-bundle";
import { createRayViewUniforms, WHOLE_PATH_TIME_M, type RayViewUniforms } from "./ray-bundle-lines";
import { composeRayFigure, type RayFigureLabels } from "./ray-figure";
import { sceneBackground, sceneInks } from "./scene-colours";
import { ViewScale } from "./view-scale";

/** Vertical field of view, degrees. */
const FIELD_OF_VIEW_DEG = 45;

/** Closest the controls let the camera come to the point it turns about, units of M (the photon sphere stays whole). */
const MIN_CAMERA_DISTANCE_M = 4;

/** Farthest the controls let the camera go, as a multiple of the framed distance. */
const MAX_ZOOM_OUT = 20;

/** What the page may do with the view. */
export interface RayBundleView {
  /** The figure (PNG data URL) of the view as it is turned, at `scale` times its size on screen, on white. */
  toFigurePngDataUrl: (scale: PngScale, labels: RayFigureLabels) => string;
  /** Frames the bundle again from the default direction for its shape (forgets the user's turn). */
  resetView: () => void;
  /** Draws each ray as far as it has travelled at slider step `step` of TIME_SLIDER_STEPS (the last: whole). */
  setTimeStep: (step: number) => void;
}

/** The quantity the escaped rays are coloured by, each ray's value and its scale; undefined: by fate. */
export interface RayColouringValues {
  values: Float32Array;
  scale: QuantityScale;
}

export interface RayBundleCanvasProps {
  bundle?: AssembledBundle;
  /** Radius the rays start from (units of M), which frames the view before any bundle exists. */
  startRadiusM: number;
  /** Radius of the lens's body (units of M) when it lies outside the photon sphere; 0 for a compact lens. */
  surfaceRadiusM: number;
  /** The lens mass for the scale's physical lengths; undefined: lengths in M only. */
  massSolar: number | undefined;
  colouring: RayColouringValues | undefined;
  onViewReady: (view: RayBundleView) => void;
  /** Called once the first frame showing the whole of `bundle` has been rendered. */
  onBundleDrawn: (bundle: AssembledBundle) => void;
}

/** Each ray's colour in `ink`: its fate's, or the ramp's at its value with the rest in grey. */
function coloursOf(bundle: AssembledBundle, colouring: RayColouringValues | undefined, ink: RampInk): Uint8Array {
  const fateColours = RAY_FATES.map((fate) => (ink === "screen" ? fateStyles[fate].color : fateStyles[fate].print.color));
  return rayColours(bundle.rayFates, colouring?.values, colouring?.scale, ink, fateColours, sceneInks.noValue[ink].color);
}

/** The region before any bundle: the start plane's width, the fan's usual height. */
const emptyExtent = (startRadiusM: number): Extent => ({ min: [-startRadiusM, -startRadiusM / 2, 0], max: [startRadiusM, startRadiusM / 2, 0] });

type Controls = ComponentRef<typeof OrbitControls>;

interface ViewFramingProps {
  extent: Extent;
  planes: number;
  controls: RefObject<Controls | null>;
  /** Whether the user has turned (or zoomed) the view since the last reset: their direction is kept. */
  userTurned: RefObject<boolean>;
  reset: RefObject<() => void>;
  uniforms: RayViewUniforms;
}

/**
 * Places the camera and the controls' target for every new extent (the Canvas `camera` prop only
 * applies at mount): from the user's own direction if they have turned the view, else the default
 * for the bundle's shape; and keeps the depth the rays fade from at the point the view turns about.
 */
function ViewFraming({ extent, planes, controls, userTurned, reset, uniforms }: ViewFramingProps) {
  const camera = useThree((state) => state.camera) as THREE.PerspectiveCamera;
  const size = useThree((state) => state.size);
  const invalidate = useThree((state) => state.invalidate);
  const aspect = size.width / Math.max(1, size.height);

  const frame = useCallback(
    (direction: Vec3) => {
      const orbit = controls.current;
      const framed = frameExtent(extent, direction, FIELD_OF_VIEW_DEG, aspect);
      camera.position.set(...framed.position);
      camera.near = framed.nearM;
      camera.far = framed.farM * MAX_ZOOM_OUT;
      camera.updateProjectionMatrix();
      uniforms.uDepthSpanM.value = Math.max(1, Math.hypot(...extent.max.map((max, axis) => max - extent.min[axis])) / 2);
      if (orbit !== null) {
        orbit.target.set(...framed.target);
        orbit.minDistance = MIN_CAMERA_DISTANCE_M;
        orbit.maxDistance = framed.distanceM * MAX_ZOOM_OUT;
        orbit.update();
      } else {
        camera.lookAt(...framed.target);
      }
      invalidate();
    },
    [extent, aspect, camera, controls, uniforms, invalidate],
  );

  // A new extent (a new bundle): reframe. A resize alone does not (the user's zoom stays).
  useEffect(() => {
    const orbit = controls.current;
    const current: Vec3 | undefined = userTurned.current && orbit !== null ? (camera.position.clone().sub(orbit.target).toArray() as Vec3) : undefined;
    frame(reframeDirection(current, planes));
    // Only a new extent or shape reframes: `frame` also changes with the aspect, which must not.
  }, [extent, planes]);

  useEffect(() => {
    reset.current = () => {
      userTurned.current = false;
      frame(defaultViewDirection(planes));
    };
  }, [frame, planes, reset, userTurned]);

  useFrame(() => {
    const orbit = controls.current;
    if (orbit !== null) uniforms.uTargetDepthM.value = camera.position.distanceTo(orbit.target);
  });
  return null;
}

/** The 3D ray-bundle view (client only: loaded with next/dynamic and ssr: false). */
export default function RayBundleCanvas({ bundle, startRadiusM, surfaceRadiusM, massSolar, colouring, onViewReady, onBundleDrawn }: RayBundleCanvasProps) {
  const uniforms = useMemo(createRayViewUniforms, []);
  const revision = useRef(0);
  const timeStep = useRef(TIME_SLIDER_STEPS);
  const getState = useRef<(() => RootState) | undefined>(undefined);
  const controls = useRef<Controls>(null);
  const userTurned = useRef(false);
  const reset = useRef<() => void>(() => undefined);
  const labelLayer = useRef<HTMLDivElement>(null);

  const radiusM = bundle?.startRadiusM ?? startRadiusM;
  const rings = useMemo(() => scaleRings(radiusM, surfaceRadiusM, massSolar), [radiusM, surfaceRadiusM, massSolar]);
  const bundleExtent = useMemo(() => bundle?.extentM ?? emptyExtent(startRadiusM), [bundle, startRadiusM]);
  const axisTipM = observerAxisTipM(bundleExtent.max[0]);
  // The axis toward the observer is framed with the rays.
  const extent = useMemo(() => extentOf(new Float32Array([axisTipM, 0, 0]), bundleExtent), [axisTipM, bundleExtent]);

  // By fate, the materials carry the colours; by a quantity, each vertex does.
  const colours = useMemo(
    () => (bundle === undefined || colouring === undefined ? undefined : vertexColours(coloursOf(bundle, colouring, "screen"), bundle.rayFirstPoint)),
    [bundle, colouring],
  );

  // The time slider's uniforms follow the bundle (its latest time sets the scale) and the slider.
  const applyTime = useCallback(() => {
    const latestM = bundle?.latestTimeM ?? 0;
    const timeM = sliderTimeM(timeStep.current, latestM);
    uniforms.uTimeM.value = Number.isFinite(timeM) ? timeM : WHOLE_PATH_TIME_M;
    uniforms.uHeadM.value = frontHeadM(timeM, latestM);
    revision.current += 1;
    getState.current?.().invalidate();
  }, [bundle, uniforms]);
  useEffect(() => {
    uniforms.uDensityOpacity.value = densityOpacity(bundle?.rayCount ?? 1);
    applyTime();
  }, [bundle, uniforms, applyTime]);

  // What the saved figure draws is read when it is saved, not captured at mount.
  const current = useRef({ bundle, colouring, rings, axisTipM, applyTime });
  current.current = { bundle, colouring, rings, axisTipM, applyTime };

  const onCreated = useCallback(
    ({ get }: RootState) => {
      getState.current = get;
      onViewReady({
        toFigurePngDataUrl: (scale, labels) => {
          const { gl, camera } = get();
          const { bundle: shown, colouring: by, rings: ringsNow, axisTipM: tipM } = current.current;
          const latestM = shown?.latestTimeM ?? 0;
          const timeM = sliderTimeM(timeStep.current, latestM);
          const figure = composeRayFigure({
            ...labels,
            widthPx: gl.domElement.width,
            heightPx: gl.domElement.height,
            camera,
            scale,
            bundle: shown,
            rayColours: shown === undefined ? undefined : coloursOf(shown, by, "print"),
            timeM,
            headM: frontHeadM(timeM, latestM),
            rings: ringsNow,
            axisTipM: tipM,
          });
          return figure.toDataURL("image/png");
        },
        resetView: () => reset.current(),
        setTimeStep: (step) => {
          timeStep.current = step;
          current.current.applyTime();
        },
      });
    },
    [onViewReady],
  );

  return (
    <div className="relative h-full w-full" data-testid="ray-bundle-canvas">
    <Canvas
      frameloop="demand"
      dpr={1}
      camera={{ position: [0, 0, 100], fov: FIELD_OF_VIEW_DEG, near: 0.1, far: 2000 }}
      // The drawing buffer is kept between frames: the bundle is drawn onto it over several frames.
      // No MSAA: software rendering multiplied the draw time by about 3.5.
      gl={{ preserveDrawingBuffer: true, antialias: false }}
      onCreated={onCreated}
    >
      <color attach="background" args={[sceneBackground.screen]} />
      <LensMass surfaceRadiusM={surfaceRadiusM} />
      <ViewScale rings={rings} axisTipM={axisTipM} labelLayer={labelLayer} />
      {bundle !== undefined ? <ProgressiveBundle bundle={bundle} colours={colours} uniforms={uniforms} revision={revision} onBundleDrawn={onBundleDrawn} /> : null}
      <OrbitControls ref={controls} makeDefault enableDamping={false} onStart={() => (userTurned.current = true)} />
      <ViewFraming extent={extent} planes={bundle?.planes ?? 2} controls={controls} userTurned={userTurned} reset={reset} uniforms={uniforms} />
    </Canvas>
      {/* The scale's labels are drawn into this layer: one that stays put (see ViewScale). */}
      <div ref={labelLayer} className="pointer-events-none absolute inset-0 overflow-hidden" />
    </div>
  );
}
