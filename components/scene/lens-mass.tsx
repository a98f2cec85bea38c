"use client";

/** The mass at the centre, in units of M: the horizon r = 2M (opaque) inside the photon sphere r = 3M (wire). */
export function LensMass() {
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
