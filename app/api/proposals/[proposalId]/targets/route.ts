import { targetCollectionRoutes } from "@/lib/server/api/target-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET, POST } = targetCollectionRoutes(sessionActor);
