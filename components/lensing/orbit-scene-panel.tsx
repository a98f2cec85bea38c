"use client";

import dynamic from "next/dynamic";
import type { OrbitCanvasProps } from "@/components/scene/orbit-canvas";

const OrbitCanvas = dynamic(() => import("@/components/scene/orbit-canvas"), {
  ssr: false,
  loading: () => <p className="p-4 text-sm text-dusk-dim">Loading the 3D view…</p>,
});

/** Radial periods the 3D view traces: enough to see successive periapses, few enough to stay legible. */
const ORBITS_SHOWN = 3;

/** The 3D view of the star's orbit in its own plane, with the words that say what it shows. */
export function OrbitScenePanel({ semiLatusRectumM, eccentricity }: Omit<OrbitCanvasProps, "orbits">) {
  return (
    <figure className="space-y-2" aria-label="The orbit in its own plane, traced by the exact Schwarzschild tracer">
      <div className="h-80 overflow-hidden rounded-md border border-void-edge">
        <OrbitCanvas semiLatusRectumM={semiLatusRectumM} eccentricity={eccentricity} orbits={ORBITS_SHOWN} />
      </div>
      <figcaption className="text-xs text-dusk-dim">
        {ORBITS_SHOWN} radial periods in the orbit&apos;s plane, traced in Schwarzschild coordinates; red dots mark each periapsis (they step forward by the
        advance, too small to see for most stars), the mass at the centre is drawn enlarged. Drag to turn the view.
      </figcaption>
    </figure>
  );
}
