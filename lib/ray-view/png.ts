import { provenanceChunks, withPngChunks } from "@/lib/exports/png-text";
import { buildProvenance, type ProvenanceValue } from "@/lib/exports/provenance";

export interface RayViewPngRequest {
  rayCount: number;
  /** Multiple of the on-screen size the view was rendered at. */
  scale: number;
  /** The bundle's inputs as the sketch holds them (impact parameters in units of M). */
  sketchInputs: Record<string, ProvenanceValue>;
  /** The bench URL, which holds every input and so reproduces the view. */
  reproduceUrl: string;
}

/**
 * The 3D view's PNG (a `data:image/png;base64,` URL from the canvas) with the same provenance text
 * chunks as every other exported figure: inputs, constants, product version, time and the link back.
 */
export function withRayViewProvenance(pngDataUrl: string, request: RayViewPngRequest): Uint8Array<ArrayBuffer> {
  const base64 = pngDataUrl.slice(pngDataUrl.indexOf(",") + 1);
  const png = Uint8Array.from(atob(base64), (character) => character.charCodeAt(0));
  const provenance = buildProvenance({
    subject: `3D view of ${request.rayCount} exact Schwarzschild light paths (lengths in units of M = GM/c^2)`,
    reproduceUrl: request.reproduceUrl,
    inputs: { ...request.sketchInputs, drawnRays: request.rayCount, pngScale: request.scale },
  });
  return Uint8Array.from(withPngChunks(png, provenanceChunks(`Arcwright ray bundle, ${request.rayCount} rays`, provenance)));
}
