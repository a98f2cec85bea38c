"use client";

import { useCallback, useEffect, useState } from "react";
import { sketchToQueryString, type Sketch, type SketchField } from "@/lib/bench/sketch-state";

/**
 * The sketch as React state, mirrored into the address bar on every change so the current link always
 * reproduces what is on screen. `replaceState` keeps typing out of the history and, unlike a router
 * navigation, does not ask the server to render the page again.
 */
export function useSketchUrl(initialSketch: Sketch) {
  const [sketch, setSketch] = useState(initialSketch);

  useEffect(() => {
    const query = sketchToQueryString(sketch);
    if (window.location.search.slice(1) !== query) window.history.replaceState(window.history.state, "", `?${query}`);
  }, [sketch]);

  const setField = useCallback(<K extends SketchField>(field: K, value: Sketch[K]) => {
    setSketch((previous) => ({ ...previous, [field]: value }));
  }, []);

  return { sketch, setSketch, setField };
}
