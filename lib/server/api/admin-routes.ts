import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { changeSiteRole, listAccounts, siteAccessOf } from "@/lib/server/admin";
import { endpoint, queryOf, readJsonOfSignedIn } from "@/lib/server/api/endpoint";

/** /api/admin/accounts */
export function accountCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint(getActor, async ({ request, actor }) => Response.json(await listAccounts(queryOf(request), actor))),
  };
}

/** /api/admin/accounts/[userId] */
export function accountRoutes(getActor: GetActor) {
  return {
    PATCH: endpoint<{ userId: string }>(getActor, async ({ request, params, actor }) =>
      Response.json({ account: await changeSiteRole(params, await readJsonOfSignedIn(request, actor), actor) }),
    ),
  };
}

/** /api/admin/access: answers every caller (200), so the header can ask without logging refusals. */
export function siteAccessRoutes(getActor: GetActor) {
  return {
    GET: endpoint(getActor, async ({ actor }) => Response.json(siteAccessOf(actor))),
  };
}
