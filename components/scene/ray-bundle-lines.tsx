"use client";

import { useEffect, useLayoutEffect, useMemo, type Ref } from "react";
import * as THREE from "three";
import { RAY_FATES, type AssembledBundle, type RayFate } from "@/lib/ray-view/assemble-bundle";
import { TIME_RULE_GLSL } from "@/lib/ray-view/time";
import { fateStyles } from "./fate-styles";

/**
 * Uniforms every ray material reads, one object shared by all of them (three.js uploads a shared
 * uniform's current value with each material): the time slider's time and head length (units of M),
 * the depth of the point the view turns about and the span over which farther rays fade (units of M),
 * and the bundle's density factor on every fate's opacity.
 */
export interface RayViewUniforms {
  uTimeM: { value: number };
  uHeadM: { value: number };
  uTargetDepthM: { value: number };
  uDepthSpanM: { value: number };
  uDensityOpacity: { value: number };
  /** 1 while each vertex carries its own colour (coloured by a quantity), 0 for each fate's colour. */
  uUseRayColour: { value: number };
}

/** A time later than any ray's (units of M): the shaders' "every path whole" (no +∞ in GLSL uniforms). */
export const WHOLE_PATH_TIME_M = 1e30;

export function createRayViewUniforms(): RayViewUniforms {
  return { uTimeM: { value: WHOLE_PATH_TIME_M }, uHeadM: { value: 0 }, uTargetDepthM: { value: 0 }, uDepthSpanM: { value: 1 }, uDensityOpacity: { value: 1 }, uUseRayColour: { value: 0 } };
}

/**
 * Most a ray at the far side of the bundle fades (share of its opacity): nearer rays draw over farther
 * ones in a turned cylinder, so its depth reads (our choice).
 */
const DEPTH_FADE = 0.65;

/** How bright a ray's head is drawn at the time slider's front: its opacity moves this far toward 1. */
const HEAD_BOOST = 0.85;

const RAY_VERTEX_SHADER = /* glsl */ `
attribute float lineDistance;
attribute float vertexTime;
attribute vec3 rayColour;
uniform vec3 uFateColour;
uniform float uUseRayColour;
varying float vLineDistance;
varying float vTime;
varying vec3 vColour;
varying float vDepth;
void main() {
  vLineDistance = lineDistance;
  vTime = vertexTime;
  vColour = mix(uFateColour, rayColour, uUseRayColour);
  vec4 mvPosition = modelViewMatrix * vec4(position, 1.0);
  vDepth = -mvPosition.z;
  gl_Position = projectionMatrix * mvPosition;
}
`;

const RAY_FRAGMENT_SHADER = /* glsl */ `
uniform float uOpacity;
uniform float uDashM;
uniform float uGapM;
uniform float uTimeM;
uniform float uHeadM;
uniform float uTargetDepthM;
uniform float uDepthSpanM;
uniform float uDensityOpacity;
varying float vLineDistance;
varying float vTime;
varying vec3 vColour;
varying float vDepth;
${TIME_RULE_GLSL}
void main() {
  if (shownAtTime(vTime, uTimeM) < 0.5) discard;
  if (uDashM > 0.0 && mod(vLineDistance, uDashM + uGapM) > uDashM) discard;
  float fade = 1.0 - ${DEPTH_FADE.toFixed(2)} * clamp((vDepth - uTargetDepthM) / uDepthSpanM, 0.0, 1.0);
  float alpha = mix(uOpacity * uDensityOpacity * fade, 1.0, ${HEAD_BOOST.toFixed(2)} * inFrontHead(vTime, uTimeM, uHeadM));
  gl_FragColor = vec4(vColour, alpha);
}
`;

/**
 * One material per fate: its opacity and dash (units of M along the ray) as uniforms, blended
 * additively so that where many rays cross the picture is brighter (the bundle's structure), never an
 * opaque slab. The colour is each vertex's `rayColour` when the rays are coloured by a quantity; by
 * fate it is the material's own and the geometry has no colour attribute, so the default view uploads
 * no colour per vertex. The shader writes colours as given (no colour-space conversion), so the hex
 * values are taken as they are rather than converted to linear light.
 */
function fateMaterials(shared: RayViewUniforms): Record<RayFate, THREE.ShaderMaterial> {
  const entries = RAY_FATES.map((fate) => {
    const style = fateStyles[fate];
    const material = new THREE.ShaderMaterial({
      vertexShader: RAY_VERTEX_SHADER,
      fragmentShader: RAY_FRAGMENT_SHADER,
      uniforms: {
        ...shared,
        uFateColour: { value: new THREE.Color().setStyle(style.color, THREE.LinearSRGBColorSpace) },
        uOpacity: { value: style.opacity },
        uDashM: { value: style.dashM ?? 0 },
        uGapM: { value: style.gapM ?? 0 },
      },
      transparent: true,
      depthWrite: false,
      blending: THREE.AdditiveBlending,
    });
    return [fate, material] as const;
  });
  return Object.fromEntries(entries) as Record<RayFate, THREE.ShaderMaterial>;
}

export interface RayBundleLinesProps {
  bundle: AssembledBundle;
  /** Each vertex's colour, [r, g, b] 0–255 (lib/ray-view/colour.ts's vertexColours); undefined: by fate. */
  colours: Uint8Array | undefined;
  uniforms: RayViewUniforms;
  ref: Ref<THREE.LineSegments>;
}

/**
 * The whole bundle as one BufferGeometry of line segments, one material per fate; which parts of the
 * index are drawn (the geometry's groups) is set frame by frame by the progressive draw.
 */
export function RayBundleLines({ bundle, colours, uniforms, ref }: RayBundleLinesProps) {
  const geometry = useMemo(() => {
    const built = new THREE.BufferGeometry();
    built.setAttribute("position", new THREE.BufferAttribute(bundle.vertices, 3));
    built.setAttribute("lineDistance", new THREE.BufferAttribute(bundle.lineDistances, 1));
    built.setAttribute("vertexTime", new THREE.BufferAttribute(bundle.vertexTimesM, 1));
    built.setIndex(new THREE.BufferAttribute(bundle.segmentIndex, 1));
    return built;
  }, [bundle]);

  // One colour attribute per geometry, refilled on recolouring (a new one each time would leave its
  // GPU buffer behind); attached only while the rays are coloured by a quantity, and set before the
  // next frame is drawn, so no frame shows the rays without their colours.
  const colourAttribute = useMemo(() => new THREE.BufferAttribute(new Uint8Array(bundle.vertices.length), 3, true), [bundle]);
  useLayoutEffect(() => {
    if (colours === undefined) {
      geometry.deleteAttribute("rayColour");
    } else {
      colourAttribute.array.set(colours);
      colourAttribute.needsUpdate = true;
      geometry.setAttribute("rayColour", colourAttribute);
    }
    uniforms.uUseRayColour.value = colours === undefined ? 0 : 1;
  }, [geometry, colourAttribute, colours, uniforms]);

  // One material per fate for the life of the view: a new bundle reuses them, so three.js keeps its
  // compiled line shaders (rebuilding them made the first frame of every bundle a 77–131 ms task).
  const materialsByFate = useMemo(() => fateMaterials(uniforms), [uniforms]);
  const materials = useMemo(() => bundle.fateGroups.map(({ fate }) => materialsByFate[fate]), [bundle, materialsByFate]);

  useEffect(
    () => () => {
      // Disposing a geometry frees the GPU buffers of the attributes it holds: the colours' too.
      geometry.setAttribute("rayColour", colourAttribute);
      geometry.dispose();
    },
    [geometry, colourAttribute],
  );
  useEffect(() => () => Object.values(materialsByFate).forEach((material) => material.dispose()), [materialsByFate]);

  // The bundle spans the whole view; culling would only cost a bounding-sphere pass over every vertex.
  return <lineSegments ref={ref} geometry={geometry} material={materials} frustumCulled={false} />;
}

const FRONT_VERTEX_SHADER = /* glsl */ `
attribute float frontTime;
uniform vec2 uOffsetPx;
uniform vec2 uViewportPx;
varying float vTime;
void main() {
  vTime = frontTime;
  gl_Position = projectionMatrix * modelViewMatrix * vec4(position, 1.0);
  gl_Position.xy += 2.0 * uOffsetPx / uViewportPx * gl_Position.w;
}
`;

const FRONT_FRAGMENT_SHADER = /* glsl */ `
uniform vec3 uColour;
uniform float uTimeM;
varying float vTime;
${TIME_RULE_GLSL}
void main() {
  if (shownAtTime(vTime, uTimeM) < 0.5) discard;
  gl_FragColor = vec4(uColour, 1.0);
}
`;

/** The uniforms of the wavefronts' material that the progressive draw sets for each of its passes. */
export interface WavefrontPassUniforms {
  uOffsetPx: { value: THREE.Vector2 };
  uViewportPx: { value: THREE.Vector2 };
  uColour: { value: THREE.Color };
}

export interface WavefrontLinesProps {
  vertices: Float32Array;
  /** The time (units of M) of the front each vertex lies on. */
  timesM: Float32Array;
  uniforms: RayViewUniforms;
  ref: Ref<THREE.LineSegments>;
}

/**
 * Lines joining the points every ray reaches at the same coordinate time, opaque and drawn over the
 * rays; a front appears once the time slider has reached its time. The progressive draw draws them in
 * several passes shifted by a pixel in the ground's colour first, so each front is a distinct line
 * with a dark edge even where dense rays add up to white.
 */
export function WavefrontLines({ vertices, timesM, uniforms, ref }: WavefrontLinesProps) {
  const geometry = useMemo(() => {
    const built = new THREE.BufferGeometry();
    built.setAttribute("position", new THREE.BufferAttribute(vertices, 3));
    built.setAttribute("frontTime", new THREE.BufferAttribute(timesM, 1));
    return built;
  }, [vertices, timesM]);
  const material = useMemo(
    () =>
      new THREE.ShaderMaterial({
        vertexShader: FRONT_VERTEX_SHADER,
        fragmentShader: FRONT_FRAGMENT_SHADER,
        uniforms: { uTimeM: uniforms.uTimeM, uOffsetPx: { value: new THREE.Vector2() }, uViewportPx: { value: new THREE.Vector2(1, 1) }, uColour: { value: new THREE.Color() } },
        depthTest: false,
        depthWrite: false,
      }),
    [uniforms],
  );
  useEffect(() => () => geometry.dispose(), [geometry]);
  useEffect(() => () => material.dispose(), [material]);
  return <lineSegments ref={ref} geometry={geometry} material={material} frustumCulled={false} />;
}
