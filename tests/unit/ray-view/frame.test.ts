import * as THREE from "three";
import { describe, expect, it } from "vitest";
import { cubeAboutOrigin, defaultViewDirection, extentOf, FRAME_MARGIN, frameExtent, reframeDirection, type Extent, type Vec3 } from "@/lib/ray-view/frame";

/** Every corner of `extent` in normalized device coordinates of a three.js camera placed at `frame` (an outside check of the framing). */
function cornersOnScreen(extent: Extent, direction: Vec3, fovDeg: number, aspect: number): { x: number; y: number }[] {
  const frame = frameExtent(extent, direction, fovDeg, aspect);
  const camera = new THREE.PerspectiveCamera(fovDeg, aspect, frame.nearM, frame.farM);
  camera.position.set(...frame.position);
  camera.lookAt(...frame.target);
  camera.updateMatrixWorld();
  const corners: { x: number; y: number }[] = [];
  for (let corner = 0; corner < 8; corner++) {
    const point = new THREE.Vector3(...([0, 1, 2].map((axis) => ((corner >> axis) & 1 ? extent.max[axis] : extent.min[axis])) as Vec3)).project(camera);
    expect(point.z).toBeGreaterThan(-1); // in front of the near plane
    expect(point.z).toBeLessThan(1); // and before the far one
    corners.push({ x: point.x, y: point.y });
  }
  return corners;
}

describe("framing the ray view from the bundle's extent", () => {
  // A fan with b up to 100 M starts at R₀ = 200 M and leaves through r₀ = √(200² + 100²) = 223.6 M.
  const wideFan: Extent = { min: [-200, -100, 0], max: [223.6, 100, 0] };

  it("fits a fan of impact parameters up to 100 M with the margin on its tighter side, face-on", () => {
    for (const aspect of [2.5, 1, 0.6]) {
      const corners = cornersOnScreen(wideFan, defaultViewDirection(2), 45, aspect);
      const reach = Math.max(...corners.flatMap(({ x, y }) => [Math.abs(x), Math.abs(y)]));
      // Inside the frame, and touching the margin on one side: the frame is tight, not merely large.
      expect(reach).toBeLessThanOrEqual(1 - FRAME_MARGIN + 1e-9);
      expect(reach).toBeGreaterThan(1 - FRAME_MARGIN - 1e-6);
    }
  });

  it("fits a small bundle as tightly: the picture scales with the extent", () => {
    const small: Extent = { min: [-30, -15, 0], max: [33.5, 15, 0] };
    expect(frameExtent(small, [0, 0, 1], 45, 2.5).distanceM / frameExtent(wideFan, [0, 0, 1], 45, 2.5).distanceM).toBeCloseTo(30 / 200, 2);
  });

  it("fits a cylinder seen from the default oblique direction, whose depth is not flat", () => {
    const cylinder: Extent = { min: [-200, -100, -100], max: [223.6, 100, 100] };
    const corners = cornersOnScreen(cylinder, defaultViewDirection(12), 45, 2.5);
    const reach = Math.max(...corners.flatMap(({ x, y }) => [Math.abs(x), Math.abs(y)]));
    expect(reach).toBeLessThanOrEqual(1 - FRAME_MARGIN + 1e-9);
    expect(reach).toBeGreaterThan(1 - FRAME_MARGIN - 1e-6);
  });

  it("still frames when looking straight down the up axis", () => {
    const corners = cornersOnScreen(wideFan, [0, 1, 0], 45, 1.5);
    // three.js's lookAt nudges a view along its up axis by 1e-4 rad, hence the looser bound.
    expect(Math.max(...corners.flatMap(({ x, y }) => [Math.abs(x), Math.abs(y)]))).toBeLessThanOrEqual(1 - FRAME_MARGIN + 1e-6);
  });

  it("looks at a fan face-on and at a cylinder from above and in front", () => {
    expect(defaultViewDirection(2)).toEqual([0, 0, 1]);
    const oblique = defaultViewDirection(12);
    expect(Math.hypot(...oblique)).toBeCloseTo(1, 12);
    expect(oblique[1]).toBeGreaterThan(0.3);
  });

  it("keeps the user's direction for a new bundle, and the shape's default after a reset", () => {
    expect(reframeDirection([0, 0, -4], 2)).toEqual([0, 0, -1]);
    expect(reframeDirection(undefined, 12)).toEqual(defaultViewDirection(12));
    expect(reframeDirection([0, 0, 0], 2)).toEqual([0, 0, 1]);
  });

  it("measures the extent of the drawn points, holding the lens's photon sphere, ignoring NaN", () => {
    const points = new Float32Array([-60, 30, 0, 61, -2, 0, NaN, NaN, NaN]);
    expect(extentOf(points, cubeAboutOrigin(3))).toEqual({ min: [-60, -3, -3], max: [61, 30, 3] });
  });
});
