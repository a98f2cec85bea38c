"use client";

import { Html } from "@react-three/drei";
import { useEffect, useMemo, type RefObject } from "react";
import * as THREE from "three";
import { OBSERVER_AXIS_LABEL, ringLabelPlacement, ringLabelText, type ScaleRing } from "@/lib/ray-view/scale";
import { sceneInks } from "./scene-colours";

/** Points per ring: smooth at the largest ring on a full-width view. */
const RING_POINTS = 192;

/** Where a label's text goes from its anchor (a CSS transform of the label's own box). */
const LABEL_SHIFT: Record<ReturnType<typeof ringLabelPlacement>["side"], string> = {
  left: "translate(calc(-100% - 4px), 2px)",
  right: "translate(4px, 2px)",
};

function SceneLabel({ position, shift, text, layer }: { position: [number, number, number]; shift: string; text: string; layer: RefObject<HTMLDivElement | null> }) {
  return (
    <Html position={position} zIndexRange={[20, 0]} style={{ pointerEvents: "none" }} portal={layer as RefObject<HTMLElement>}>
      <span
        data-testid="ray-view-scale-label"
        className="block whitespace-nowrap rounded bg-void/75 px-1 text-[11px] leading-4 text-dusk"
        style={{ transform: shift }}
      >
        {text}
      </span>
    </Html>
  );
}

function Ring({ ring, layer }: { ring: ScaleRing; layer: RefObject<HTMLDivElement | null> }) {
  const geometry = useMemo(() => {
    const points = new Float32Array(3 * RING_POINTS);
    for (let k = 0; k < RING_POINTS; k++) {
      const angle = (2 * Math.PI * k) / RING_POINTS;
      points[3 * k] = ring.radiusM * Math.cos(angle);
      points[3 * k + 1] = ring.radiusM * Math.sin(angle);
    }
    return new THREE.BufferGeometry().setAttribute("position", new THREE.BufferAttribute(points, 3));
  }, [ring.radiusM]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  const { angleRad, side } = ringLabelPlacement(ring);
  const ink = ring.kind === "photon-sphere" ? sceneInks.photonSphere.screen : sceneInks.scale.screen;
  return (
    <>
      <lineLoop geometry={geometry}>
        <lineBasicMaterial color={ink.color} transparent opacity={ink.opacity} depthWrite={false} />
      </lineLoop>
      <SceneLabel position={[ring.radiusM * Math.cos(angleRad), ring.radiusM * Math.sin(angleRad), 0]} shift={LABEL_SHIFT[side]} text={ringLabelText(ring)} layer={layer} />
    </>
  );
}

/**
 * The view's scale: rings in the rays' plane (z = 0, the fan's plane, which holds the axis toward the
 * observer) at the horizon, the photon sphere or the lens's surface and at round radii, labelled in M
 * and, for a known mass, in km or au; and the axis from the lens toward the distant observer (+x).
 * The labels are drawn into `labelLayer`, a page element beside the canvas that stays put: left to
 * itself, drei's Html re-parents every label when the canvas connects its events, and in Chromium the
 * first label mounted came out empty after that move (its container present, its text never drawn).
 */
export function ViewScale({ rings, axisTipM, labelLayer }: { rings: ScaleRing[]; axisTipM: number; labelLayer: RefObject<HTMLDivElement | null> }) {
  const axis = useMemo(() => new THREE.BufferGeometry().setAttribute("position", new THREE.BufferAttribute(new Float32Array([0, 0, 0, axisTipM, 0, 0]), 3)), [axisTipM]);
  useEffect(() => () => axis.dispose(), [axis]);
  const headM = 0.04 * axisTipM;
  return (
    <group>
      {rings.map((ring) => (
        <Ring key={`${ring.kind}-${ring.radiusM}`} ring={ring} layer={labelLayer} />
      ))}
      <lineSegments geometry={axis}>
        <lineBasicMaterial color={sceneInks.wavefront.screen.color} transparent opacity={0.8} depthWrite={false} />
      </lineSegments>
      <mesh position={[axisTipM - headM / 2, 0, 0]} rotation={[0, 0, -Math.PI / 2]}>
        <coneGeometry args={[headM * 0.35, headM, 16]} />
        <meshBasicMaterial color={sceneInks.wavefront.screen.color} />
      </mesh>
      <SceneLabel position={[axisTipM, 0, 0]} shift="translate(-100%, calc(-100% - 6px))" text={OBSERVER_AXIS_LABEL} layer={labelLayer} />
    </group>
  );
}
