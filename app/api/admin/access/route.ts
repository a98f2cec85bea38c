import { siteAccessRoutes } from "@/lib/server/api/admin-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = siteAccessRoutes(sessionActor);
