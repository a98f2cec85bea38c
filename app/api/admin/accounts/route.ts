import { accountCollectionRoutes } from "@/lib/server/api/admin-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = accountCollectionRoutes(sessionActor);
