"use client";

import { OrbitControls } from "@react-three/drei";
import { Canvas } from "@react-three/fiber";
import { useMemo } from "react";
import * as THREE from "three";
import { traceBoundOrbit } from "@/lib/physics/orbit-tracer";
import { plotPalette } from "@/lib/figures/plot-palette";
import { sceneBackground } from "./scene-colours";

/** Vertical field of view, degrees. */
const FIELD_OF_VIEW_DEG = 45;
/** Samples per radial period of the traced orbit. */
const SAMPLES_PER_ORBIT = 720;
/** The mass is drawn at least this share of the apoapsis distance across, or a real horizon (2M) would be far below a pixel. */
const MASS_MARK_SHARE = 0.015;

export interface OrbitCanvasProps {
  /** Semi-latus rectum of the orbit, units of M = GM/c² (above 6 + 2e: a stable bound orbit). */
  semiLatusRectumM: number;
  /** Eccentricity, 0 < e < 1. */
  eccentricity: number;
  /** Radial periods traced (1 to 10). */
  orbits: number;
}

/** The orbit-plane track (x, y in units of M, z = 0) of the physics core's exact tracer, and each periapsis passed. */
function tracedOrbit({ semiLatusRectumM: p, eccentricity: e, orbits }: OrbitCanvasProps) {
  const traced = traceBoundOrbit(p, e, 1, { orbits, samples: orbits * SAMPLES_PER_ORBIT + 1 });
  const positions = new Float32Array(traced.count * 3);
  for (let k = 0; k < traced.count; k++) {
    positions[3 * k] = traced.xy[2 * k];
    positions[3 * k + 1] = traced.xy[2 * k + 1];
  }
  const periapsisM = p / (1 + e);
  // The k-th periapsis lies at polar angle k (2π + Δφ), at r = p/(1 + e).
  const periapses = new Float32Array((orbits + 1) * 3);
  for (let k = 0; k <= orbits; k++) {
    const angle = k * (2 * Math.PI + traced.periastronAdvance);
    periapses[3 * k] = periapsisM * Math.cos(angle);
    periapses[3 * k + 1] = periapsisM * Math.sin(angle);
  }
  return { positions, periapses, apoapsisM: p / (1 - e) };
}

/**
 * The star's orbit about the compact mass in its own plane (client only: loaded with next/dynamic and
 * ssr: false), traced by the physics core over a few radial periods, with every periapsis marked and
 * the mass at the centre (drawn enlarged). Drag to turn the view.
 */
export default function OrbitCanvas({ semiLatusRectumM, eccentricity, orbits }: OrbitCanvasProps) {
  const { positions, periapses, apoapsisM } = useMemo(() => tracedOrbit({ semiLatusRectumM, eccentricity, orbits }), [semiLatusRectumM, eccentricity, orbits]);
  const track = useMemo(() => new THREE.BufferGeometry().setAttribute("position", new THREE.BufferAttribute(positions, 3)), [positions]);
  const marks = useMemo(() => new THREE.BufferGeometry().setAttribute("position", new THREE.BufferAttribute(periapses, 3)), [periapses]);
  // The apoapsis lies on −x: the camera looks at the middle of the major axis from above the plane, tilted.
  const centre = (-apoapsisM + periapses[0]) / 2;
  const distance = (1.15 * (apoapsisM + periapses[0])) / 2 / Math.tan(((FIELD_OF_VIEW_DEG / 2) * Math.PI) / 180);
  return (
    <Canvas
      frameloop="demand"
      dpr={[1, 2]}
      camera={{ position: [centre, -0.45 * distance, 0.9 * distance], fov: FIELD_OF_VIEW_DEG, near: distance / 1000, far: 20 * distance, up: [0, 0, 1] }}
      // Kept between frames so the drawn view can be read back (a figure, a browser test's pixels).
      gl={{ preserveDrawingBuffer: true }}
      data-testid="orbit-canvas"
    >
      <color attach="background" args={[sceneBackground.screen]} />
      <threeLine geometry={track}>
        <lineBasicMaterial color={plotPalette.orange} />
      </threeLine>
      <points geometry={marks}>
        <pointsMaterial color={plotPalette.vermillion} size={9} sizeAttenuation={false} />
      </points>
      <mesh>
        <sphereGeometry args={[MASS_MARK_SHARE * apoapsisM, 24, 12]} />
        <meshBasicMaterial color={plotPalette.ink} />
      </mesh>
      <OrbitControls makeDefault target={[centre, 0, 0]} enableDamping={false} />
    </Canvas>
  );
}
