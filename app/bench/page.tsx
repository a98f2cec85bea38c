import type { Metadata } from "next";
import { LensBench } from "@/components/bench/lens-bench";
import { sketchFromSearchParams } from "@/lib/bench/sketch-state";

export const metadata: Metadata = { title: "Lens bench" };

/** The lens bench, open without signing in; the query string carries the whole sketch. */
export default async function BenchPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sketch = sketchFromSearchParams(await searchParams);
  return <LensBench initialSketch={sketch} />;
}
