import { SUN_POINTING_CAUTION } from "@/lib/astro/sun-caution";

/** The caution shown whenever a pointing would come closer to the Sun than the safe elongation. */
export function SunCaution({ elongationDeg, safeElongationDeg }: { elongationDeg: number; safeElongationDeg: number }) {
  return (
    <div role="alert" data-testid="sun-caution" className="rounded-md border border-alarm bg-void-raised p-3 text-alarm">
      <p className="font-semibold">
        Too close to the Sun: {elongationDeg.toFixed(1)}° away, safe elongation {safeElongationDeg.toFixed(0)}°. This
        night is marked unusable.
      </p>
      <p className="mt-1 text-sm">{SUN_POINTING_CAUTION}</p>
    </div>
  );
}
