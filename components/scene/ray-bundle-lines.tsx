"use client";

import { useEffect, useMemo } from "react";
import * as THREE from "three";
import type { AssembledBundle } from "@/lib/bench/assemble-bundle";
import { fateStyles } from "./fate-styles";

/** The whole bundle as one BufferGeometry of line segments, one draw group (and material) per fate. */
export function RayBundleLines({ bundle }: { bundle: AssembledBundle }) {
  const geometry = useMemo(() => {
    const built = new THREE.BufferGeometry();
    built.setAttribute("position", new THREE.BufferAttribute(bundle.vertices, 3));
    built.setAttribute("lineDistance", new THREE.BufferAttribute(bundle.lineDistances, 1));
    built.setIndex(new THREE.BufferAttribute(bundle.segmentIndex, 1));
    bundle.fateGroups.forEach((group, materialIndex) => built.addGroup(group.start, group.count, materialIndex));
    return built;
  }, [bundle]);

  const materials = useMemo(
    () =>
      bundle.fateGroups.map(({ fate }) => {
        const style = fateStyles[fate];
        return style.dashM === undefined
          ? new THREE.LineBasicMaterial({ color: style.color, transparent: true, opacity: style.opacity, depthWrite: false })
          : new THREE.LineDashedMaterial({ color: style.color, dashSize: style.dashM, gapSize: style.gapM, transparent: true, opacity: style.opacity, depthWrite: false });
      }),
    [bundle],
  );

  useEffect(() => () => geometry.dispose(), [geometry]);
  useEffect(() => () => materials.forEach((material) => material.dispose()), [materials]);

  // The bundle spans the whole view; culling would only cost a bounding-sphere pass over every vertex.
  return <lineSegments geometry={geometry} material={materials} frustumCulled={false} />;
}

/** Lines joining the points every ray reaches at the same coordinate time. */
export function WavefrontLines({ vertices }: { vertices: Float32Array }) {
  const geometry = useMemo(() => {
    const built = new THREE.BufferGeometry();
    built.setAttribute("position", new THREE.BufferAttribute(vertices, 3));
    return built;
  }, [vertices]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  return (
    // Drawn last and over the rays, so the fronts stay visible inside a dense bundle.
    <lineSegments geometry={geometry} frustumCulled={false} renderOrder={1}>
      <lineBasicMaterial color="#f4f1ea" depthTest={false} />
    </lineSegments>
  );
}
