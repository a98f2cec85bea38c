"use client";

import { sceneInks } from "./scene-colours";

/**
 * The mass at the centre, in units of M: for a compact lens the horizon r = 2M (opaque) inside the
 * photon sphere r = 3M (wire); for a body larger than its photon sphere, only the body (neither exists
 * outside it).
 */
export function LensMass({ surfaceRadiusM }: { surfaceRadiusM: number }) {
  if (surfaceRadiusM > 0) {
    return (
      <mesh>
        <sphereGeometry args={[surfaceRadiusM, 48, 24]} />
        <meshBasicMaterial color={sceneInks.surface.screen.color} />
      </mesh>
    );
  }
  return (
    <group>
      <mesh>
        <sphereGeometry args={[2, 48, 24]} />
        <meshBasicMaterial color={sceneInks.horizon.screen.color} />
      </mesh>
      <mesh>
        <sphereGeometry args={[2.02, 24, 12]} />
        <meshBasicMaterial color={sceneInks.horizonWire.screen.color} wireframe transparent opacity={sceneInks.horizonWire.screen.opacity} />
      </mesh>
      <mesh>
        <sphereGeometry args={[3, 32, 16]} />
        <meshBasicMaterial color={sceneInks.photonSphere.screen.color} wireframe transparent opacity={sceneInks.photonSphere.screen.opacity} />
      </mesh>
    </group>
  );
}
