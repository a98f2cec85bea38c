import { memberCollectionRoutes } from "@/lib/server/api/member-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = memberCollectionRoutes(sessionActor);
