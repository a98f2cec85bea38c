"use client";

import dynamic from "next/dynamic";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { RAY_FATES, type AssembledBundle } from "@/lib/ray-view/assemble-bundle";
import { withLensSurface } from "@/lib/ray-view/bundle-surface";
import { formatSignificant } from "@/lib/numbers/significant";
import { hasPhotonSphere, lensRadiusInMassUnits } from "@/lib/bench/lens-surface";
import { parseBundle } from "@/lib/bench/parse-sketch";
import { quantityScale, RAY_COLOURINGS, rampStops, rayQuantity, type QuantityScale, type RayColouring } from "@/lib/ray-view/colour";
import { sliderTimeM, sliderTimeText, TIME_SLIDER_STEPS } from "@/lib/ray-view/time";
import type { Sketch } from "@/lib/bench/sketch-state";
import { fateStyles } from "@/components/scene/fate-styles";
import { PNG_SCALES, type PngScale } from "@/components/scene/png-scale";
import { withRayViewProvenance } from "@/lib/ray-view/png";
import { physicalSizeChunk, withPngChunks } from "@/lib/exports/png-text";
import type { RayBundleView, RayColouringValues } from "@/components/scene/ray-bundle-canvas";
import type { FigureKeyEntry } from "@/components/scene/ray-figure";
import { bundleMassSolar, captionChunk, figureDpi, rayFigureCaption } from "@/components/scene/ray-figure-text";
import { sceneInks } from "@/components/scene/scene-colours";
import { ChoiceField, sketchTextFields, type FieldChange } from "./sketch-field";
import { TRACE_START_MARK, useRayTrace } from "./use-ray-trace";

const RayBundleCanvas = dynamic(() => import("@/components/scene/ray-bundle-canvas"), {
  ssr: false,
  loading: () => <p className="p-4 text-sm text-dusk-dim">Loading the 3D view…</p>,
});

/** The mark set when a bundle first appears on screen (read by the browser benchmark). */
export const BUNDLE_DRAWN_MARK = "bench:bundle-drawn";

/** Start radius of the view before the first bundle, units of M (as the demo bundle's). */
const INITIAL_START_RADIUS_M = 30;

interface RayBundlePanelProps {
  sketch: Sketch;
  onFieldChange: FieldChange;
}

/**
 * The rays by fate, each with its dash, colour and count. Coloured by a quantity, the escaped rays'
 * colour is the ramp's (shown by RampLegend) and the others are grey: their dash tells them apart.
 */
function FateLegend({ bundle, hasSurface, byQuantity }: { bundle?: AssembledBundle; hasSurface: boolean; byQuantity: boolean }) {
  const rampGradient = `linear-gradient(to right, ${rampStops("screen").join(", ")})`;
  return (
    <ul aria-label="Rays by fate" className="flex flex-wrap gap-x-6 gap-y-1 text-sm">
      {RAY_FATES.filter((fate) => hasSurface || fate !== "surface").map((fate) => {
        const style = fateStyles[fate];
        const isOnRamp = byQuantity && fate === "escaped";
        return (
          <li key={fate} className="flex items-center gap-2">
            {isOnRamp ? (
              <span aria-hidden="true" className="inline-block h-1 w-9" style={{ backgroundImage: rampGradient }} />
            ) : (
              <svg width="36" height="8" aria-hidden="true">
                <line x1="0" y1="4" x2="36" y2="4" stroke={byQuantity ? sceneInks.noValue.screen.color : style.color} strokeWidth="2.5" strokeDasharray={style.legendDash} />
              </svg>
            )}
            <span>
              {style.label}: <span className="font-mono text-glint" data-testid={`fate-count-${fate}`}>{bundle?.fateCounts[fate] ?? "—"}</span>
            </span>
          </li>
        );
      })}
      <li className="flex items-center gap-2">
        <svg width="36" height="8" aria-hidden="true">
          <line x1="0" y1="4" x2="36" y2="4" stroke={sceneInks.wavefront.screen.color} strokeWidth="1" />
        </svg>
        Wavefronts (equal coordinate time)
      </li>
    </ul>
  );
}

/** The colour ramp of the chosen quantity with its round values written under it (not colour alone). */
function RampLegend({ scale }: { scale: QuantityScale }) {
  return (
    <figure aria-label="Colour scale" data-testid="ray-colour-scale" className="max-w-md text-sm">
      <figcaption className="text-dusk-dim">{scale.title}; escaped rays only</figcaption>
      <div aria-hidden="true" className="mt-1 h-2.5 rounded-sm" style={{ backgroundImage: `linear-gradient(to right, ${rampStops("screen").join(", ")})` }} />
      <ol className="relative h-5">
        {scale.ticks.map((tick) => (
          <li key={tick.label} data-testid="ray-colour-scale-tick" className="absolute top-0 -translate-x-1/2 font-mono text-xs text-dusk" style={{ left: `${tick.fraction * 100}%` }}>
            {tick.label}
          </li>
        ))}
      </ol>
    </figure>
  );
}

/**
 * The key under a saved figure, in print ink: the fates by colour and dash (the escaped rays left to
 * the colour ramp when coloured by a quantity, the others then grey) and the wavefronts.
 */
function figureKey(hasSurface: boolean, byQuantity: boolean): FigureKeyEntry[] {
  const fates = RAY_FATES.filter((fate) => (hasSurface || fate !== "surface") && !(byQuantity && fate === "escaped")).map((fate) => ({
    label: fateStyles[fate].label.split(" (")[0],
    color: byQuantity ? sceneInks.noValue.print.color : fateStyles[fate].print.color,
    dashPx: fateStyles[fate].legendDash?.split(" ").map(Number) ?? [],
  }));
  return [...fates, { label: "Wavefronts", color: sceneInks.wavefront.print.color, dashPx: [] }];
}

/** The 3D ray bundle: its own inputs (kept in the URL like the rest), the trace control and the view. */
export function RayBundlePanel({ sketch, onFieldChange }: RayBundlePanelProps) {
  const parsed = useMemo(() => parseBundle(sketch), [sketch]);
  const fieldErrors = parsed.ok ? {} : parsed.fieldErrors;
  const { bundle: tracedBundle, isTracing, progress, error, trace, cancel } = useRayTrace();
  // A lens larger than its photon sphere ends the rays that reach its surface (R in units of M).
  const radiusOverM = useMemo(() => lensRadiusInMassUnits(sketch), [sketch]);
  const hasSurface = radiusOverM > 0 && !hasPhotonSphere(radiusOverM, 1);
  const bundle = useMemo(() => (tracedBundle !== undefined && hasSurface ? withLensSurface(tracedBundle, radiusOverM) : tracedBundle), [tracedBundle, hasSurface, radiusOverM]);
  const viewRef = useRef<RayBundleView | undefined>(undefined);
  const [drawnBundle, setDrawnBundle] = useState<AssembledBundle | undefined>(undefined);
  const [pngScale, setPngScale] = useState<PngScale>(2);
  const [colouringChoice, setColouringChoice] = useState<RayColouring>("fate");
  const massSolar = useMemo(() => bundleMassSolar(sketch), [sketch]);
  const colouring = useMemo((): RayColouringValues | undefined => {
    if (bundle === undefined || colouringChoice === "fate") return undefined;
    const values = rayQuantity(bundle, colouringChoice);
    const scale = quantityScale(values, colouringChoice);
    return scale === undefined ? undefined : { values, scale };
  }, [bundle, colouringChoice]);

  // The time slider is not React state: it moves the view's uniforms and its own reading directly.
  const timeSlider = useRef<HTMLInputElement>(null);
  const timeReading = useRef<HTMLOutputElement>(null);
  const showTime = useCallback(() => {
    const step = Number(timeSlider.current?.value ?? TIME_SLIDER_STEPS);
    viewRef.current?.setTimeStep(step);
    if (timeReading.current !== null) timeReading.current.textContent = sliderTimeText(sliderTimeM(step, bundle?.latestTimeM ?? 0), massSolar);
  }, [bundle, massSolar]);
  useEffect(showTime, [showTime]);

  const parsedBundle = parsed.ok ? parsed.bundle : undefined;
  const startTrace = useCallback(() => {
    if (parsedBundle !== undefined) void trace(parsedBundle);
  }, [parsedBundle, trace]);

  // A shared link should show its bundle without a click; later traces are the user's to start.
  const hasAutoTraced = useRef(false);
  useEffect(() => {
    if (hasAutoTraced.current || parsedBundle === undefined) return;
    hasAutoTraced.current = true;
    startTrace();
  }, [parsedBundle, startTrace]);

  // Changing a ray input makes the bundle in flight stale, so it never lands over the new inputs.
  const inputsKey = `${sketch.rays}|${sketch.bmin}|${sketch.bmax}|${sketch.layout}`;
  const tracedKey = useRef(inputsKey);
  useEffect(() => {
    if (tracedKey.current === inputsKey) return;
    tracedKey.current = inputsKey;
    cancel();
  }, [inputsKey, cancel]);

  const onBundleDrawn = useCallback((drawn: AssembledBundle) => {
    performance.mark(BUNDLE_DRAWN_MARK);
    performance.measure("bench:trace-to-drawn", TRACE_START_MARK, BUNDLE_DRAWN_MARK);
    setDrawnBundle(drawn);
  }, []);

  const onViewReady = useCallback((view: RayBundleView) => {
    viewRef.current = view;
  }, []);

  const savePng = () => {
    const view = viewRef.current;
    if (view === undefined || parsedBundle === undefined) return;
    const link = document.createElement("a");
    const rayCount = drawnBundle?.rayCount ?? 0;
    const caption = rayFigureCaption({ massSolar, bMinM: parsedBundle.bMinM, bMaxM: parsedBundle.bMaxM, rayCount, layout: parsedBundle.layout });
    const dataUrl = view.toFigurePngDataUrl(pngScale, { surfaceRadiusM: hasSurface ? radiusOverM : 0, massSolar, caption, key: figureKey(hasSurface, colouring !== undefined), ramp: colouring?.scale });
    const withProvenance = withRayViewProvenance(dataUrl, {
      rayCount,
      scale: pngScale,
      sketchInputs: { rays: sketch.rays, bminM: sketch.bmin, bmaxM: sketch.bmax, layout: sketch.layout },
      reproduceUrl: window.location.href,
    });
    const png = Uint8Array.from(withPngChunks(withProvenance, [physicalSizeChunk(figureDpi(pngScale)), captionChunk(caption)], ["pHYs"]));
    const url = URL.createObjectURL(new Blob([png], { type: "image/png" }));
    const scaleSuffix = pngScale === 1 ? "" : `-${pngScale}x`;
    link.href = url;
    link.download = `arcwright-ray-bundle-${rayCount}-rays${scaleSuffix}.png`;
    link.click();
    setTimeout(() => URL.revokeObjectURL(url), 10_000);
  };

  const text = sketchTextFields(sketch, fieldErrors, onFieldChange);

  return (
    <section aria-label="Ray bundle" className="space-y-3 rounded-md border border-void-edge bg-void-raised p-4">
      <h2 className="text-base font-semibold text-dusk">Ray bundle: exact light paths past the mass</h2>
      <p className="text-sm text-dusk-dim">
        Lengths in units of M = GM/c². Black: the horizon (r = 2M); pink wire: the photon sphere (r = 3M); rings in the rays&apos; plane
        mark round radii. Rays with b below b_c = 3√3 M ≈ 5.196 M are captured. Drag to turn the view, scroll to zoom; the time
        slider draws each ray as far as it has travelled.
      </p>
      <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
        {text("rays", "1 to 5000")}
        {text("bmin", "a plain number, e.g. 0.5")}
        {text("bmax", "a plain number, up to 100")}
        <ChoiceField
          legend="Bundle shape"
          value={sketch.layout}
          onChange={(value) => onFieldChange("layout", value)}
          options={[
            { value: "fan", label: "Planar fan" },
            { value: "cylinder", label: "Full cylinder" },
          ]}
        />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button
          type="button"
          onClick={startTrace}
          disabled={parsedBundle === undefined}
          className="rounded-md bg-ember px-4 py-1.5 font-semibold text-void hover:bg-ember-strong disabled:opacity-50"
        >
          Trace rays
        </button>
        <button
          type="button"
          onClick={savePng}
          disabled={drawnBundle === undefined || parsedBundle === undefined}
          className="rounded-md border border-void-edge px-3 py-1.5 text-sm text-dusk hover:border-ember disabled:opacity-50"
        >
          Save view as PNG
        </button>
        <label className="flex items-center gap-1 text-sm text-dusk-dim">
          at
          <select
            aria-label="PNG resolution"
            value={pngScale}
            onChange={(event) => setPngScale(Number(event.target.value) as PngScale)}
            className="rounded border border-void-edge bg-void px-1 py-1 text-dusk"
          >
            {PNG_SCALES.map((scale) => (
              <option key={scale} value={scale}>
                {scale}× screen size
              </option>
            ))}
          </select>
        </label>
        <span role="status" aria-live="polite" className="text-sm text-dusk-dim" data-testid="trace-status" data-drawn-rays={drawnBundle?.rayCount ?? 0}>
          {isTracing ? "Tracing…" : drawnBundle !== undefined ? `${drawnBundle.rayCount} rays drawn` : ""}
        </span>
        {isTracing && progress !== undefined ? (
          <progress aria-label="Tracing progress" value={progress} max={1} className="h-2 w-48 accent-ember" />
        ) : null}
      </div>
      {error !== undefined ? (
        <p role="alert" className="text-sm text-alarm">
          Tracing failed: {error}
        </p>
      ) : null}
      {hasSurface ? (
        <p className="text-sm text-ember" data-testid="ray-bundle-surface-note">
          This lens has a surface at R = {formatSignificant(radiusOverM, 3)} M, outside its photon sphere (3 M): rays with b below R end on it, and it has no
          photon sphere, horizon or shadow.
          {radiusOverM >= (bundle?.startRadiusM ?? INITIAL_START_RADIUS_M) ? " The whole traced region lies inside the body, so every ray here ends on its surface." : ""}
        </p>
      ) : null}
      <div className="flex flex-wrap items-end gap-x-6 gap-y-2">
        <label className="flex items-center gap-2 text-sm text-dusk-dim">
          Colour rays by
          <select
            aria-label="Colour rays by"
            value={colouringChoice}
            onChange={(event) => setColouringChoice(event.target.value as RayColouring)}
            className="rounded border border-void-edge bg-void px-1 py-1 text-dusk"
          >
            {RAY_COLOURINGS.map((option) => (
              <option key={option.value} value={option.value}>
                {option.label}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 text-sm text-dusk-dim">
          Coordinate time
          <input
            ref={timeSlider}
            type="range"
            aria-label="Coordinate time"
            min={0}
            max={TIME_SLIDER_STEPS}
            defaultValue={TIME_SLIDER_STEPS}
            onInput={showTime}
            className="w-56 accent-ember"
          />
          <output ref={timeReading} data-testid="ray-time-reading" className="min-w-40 font-mono text-xs text-dusk" />
        </label>
        <button
          type="button"
          onClick={() => viewRef.current?.resetView()}
          className="rounded-md border border-void-edge px-3 py-1.5 text-sm text-dusk hover:border-ember"
        >
          Reset view
        </button>
      </div>
      <FateLegend bundle={bundle} hasSurface={hasSurface} byQuantity={colouring !== undefined} />
      {colouring !== undefined ? <RampLegend scale={colouring.scale} /> : null}
      <div className="h-[480px] overflow-hidden rounded border border-void-edge">
        <RayBundleCanvas
          bundle={bundle}
          startRadiusM={INITIAL_START_RADIUS_M}
          surfaceRadiusM={hasSurface ? radiusOverM : 0}
          massSolar={massSolar}
          colouring={colouring}
          onViewReady={onViewReady}
          onBundleDrawn={onBundleDrawn}
        />
      </div>
    </section>
  );
}
