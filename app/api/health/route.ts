import { checkDatabase } from "@/lib/server/health";

export const dynamic = "force-dynamic";

/** Liveness and database reachability: 200 only after a real query succeeded, else 503 with why. */
export async function GET() {
  const database = await checkDatabase();
  if (database.ok) {
    return Response.json({ status: "ok", database: "ok", latencyMs: database.latencyMs }, { headers: { "Cache-Control": "no-store" } });
  }
  return Response.json(
    { status: "degraded", database: "down", reason: database.reason },
    { status: 503, headers: { "Retry-After": "5", "Cache-Control": "no-store" } },
  );
}
