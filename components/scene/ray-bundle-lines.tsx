"use client";

import { useEffect, useMemo, type Ref } from "react";
import * as THREE from "three";
import type { AssembledBundle, RayFate } from "@/lib/bench/assemble-bundle";
import { fateStyles } from "./fate-styles";
import { inkData, sceneInks } from "./scene-colours";

function fateMaterials(): Record<RayFate, THREE.Material> {
  const entries = Object.entries(fateStyles).map(([fate, style]) => {
    const userData = inkData({ screen: { color: style.color, opacity: style.opacity }, print: style.print });
    const common = { color: style.color, transparent: true, opacity: style.opacity, depthWrite: false, userData };
    return [fate, style.dashM === undefined ? new THREE.LineBasicMaterial(common) : new THREE.LineDashedMaterial({ ...common, dashSize: style.dashM, gapSize: style.gapM })];
  });
  return Object.fromEntries(entries) as Record<RayFate, THREE.Material>;
}

/**
 * The whole bundle as one BufferGeometry of line segments, one material per fate; which parts of the
 * index are drawn (the geometry's groups) is set frame by frame by the progressive draw.
 */
export function RayBundleLines({ bundle, ref }: { bundle: AssembledBundle; ref: Ref<THREE.LineSegments> }) {
  const geometry = useMemo(() => {
    const built = new THREE.BufferGeometry();
    built.setAttribute("position", new THREE.BufferAttribute(bundle.vertices, 3));
    built.setAttribute("lineDistance", new THREE.BufferAttribute(bundle.lineDistances, 1));
    built.setIndex(new THREE.BufferAttribute(bundle.segmentIndex, 1));
    return built;
  }, [bundle]);

  // One material per fate for the life of the view: a new bundle reuses them, so three.js keeps its
  // compiled line shaders (rebuilding them made the first frame of every bundle a 77–131 ms task).
  const materialsByFate = useMemo(() => fateMaterials(), []);
  const materials = useMemo(() => bundle.fateGroups.map(({ fate }) => materialsByFate[fate]), [bundle, materialsByFate]);

  useEffect(() => () => geometry.dispose(), [geometry]);
  useEffect(() => () => Object.values(materialsByFate).forEach((material) => material.dispose()), [materialsByFate]);

  // The bundle spans the whole view; culling would only cost a bounding-sphere pass over every vertex.
  return <lineSegments ref={ref} geometry={geometry} material={materials} frustumCulled={false} />;
}

/** Lines joining the points every ray reaches at the same coordinate time. */
export function WavefrontLines({ vertices, ref }: { vertices: Float32Array; ref: Ref<THREE.LineSegments> }) {
  const geometry = useMemo(() => {
    const built = new THREE.BufferGeometry();
    built.setAttribute("position", new THREE.BufferAttribute(vertices, 3));
    return built;
  }, [vertices]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  return (
    // Drawn last and over the rays, so the fronts stay visible inside a dense bundle.
    <lineSegments ref={ref} geometry={geometry} frustumCulled={false}>
      <lineBasicMaterial color={sceneInks.wavefront.screen.color} depthTest={false} userData={inkData(sceneInks.wavefront)} />
    </lineSegments>
  );
}
