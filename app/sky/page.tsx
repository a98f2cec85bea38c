import type { Metadata } from "next";
import { SkyPlanner } from "@/components/sky/sky-planner";
import { defaultSkyQuery, skyQueryFromParams } from "@/lib/astro/sky-query";

export const metadata: Metadata = { title: "Sky windows" };

/** Sky windows for any site and target, without signing in; reads only the address bar. */
export default async function SkyPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const todayIso = new Date().toISOString().slice(0, 10);
  const query = skyQueryFromParams(params, defaultSkyQuery(todayIso));
  return (
    <section className="space-y-4">
      <h1 className="text-3xl font-bold text-dusk">Sky windows</h1>
      <p className="max-w-3xl text-dusk-dim">
        When a target can be observed from a site: its altitude and air mass through the night, the twilights,
        the Moon, and the usable dark hours across a season. Nothing here is stored; the link holds every input.
      </p>
      <SkyPlanner key={JSON.stringify(query)} initialQuery={query} />
    </section>
  );
}
