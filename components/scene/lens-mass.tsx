"use client";

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
        <meshBasicMaterial color="#3a3a3a" />
      </mesh>
    );
  }
  return (
    <group>
      <mesh>
        <sphereGeometry args={[2, 48, 24]} />
        <meshBasicMaterial color="#000000" />
      </mesh>
      <mesh>
        <sphereGeometry args={[2.02, 24, 12]} />
        <meshBasicMaterial color="#8f8a80" wireframe transparent opacity={0.35} />
      </mesh>
      <mesh>
        <sphereGeometry args={[3, 32, 16]} />
        <meshBasicMaterial color="#CC79A7" wireframe transparent opacity={0.35} />
      </mesh>
    </group>
  );
}
