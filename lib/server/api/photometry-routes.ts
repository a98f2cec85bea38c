import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, noContent, readJsonOfSignedIn } from "@/lib/server/api/endpoint";
import { commitPhotometry, deletePhotometryFile, getTargetPhotometry, previewPhotometry } from "@/lib/server/event-photometry";

type TargetParams = { proposalId: string; targetId: string };
type PhotometryParams = TargetParams & { photometryId: string };

/** /api/proposals/[proposalId]/targets/[targetId]/photometry — the files kept with their points; keep an uploaded file. */
export function photometryCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint<TargetParams>(getActor, async ({ params, actor }) => Response.json(await getTargetPhotometry(params, actor))),
    POST: endpoint<TargetParams>(getActor, async ({ request, params, actor }) =>
      Response.json(await commitPhotometry(params, await readJsonOfSignedIn(request, actor), actor), { status: 201 }),
    ),
  };
}

/** .../photometry/preview — how an uploaded file reads under a mapping, row by row; writes nothing. */
export function photometryPreviewRoutes(getActor: GetActor) {
  return {
    POST: endpoint<TargetParams>(getActor, async ({ request, params, actor }) => Response.json(await previewPhotometry(params, await readJsonOfSignedIn(request, actor), actor))),
  };
}

/** .../photometry/[photometryId] — remove a kept file, its points and its stored bytes. */
export function photometryFileRoutes(getActor: GetActor) {
  return {
    DELETE: endpoint<PhotometryParams>(getActor, async ({ params, actor }) => {
      await deletePhotometryFile(params, actor);
      return noContent();
    }),
  };
}
