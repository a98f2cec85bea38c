import { targetRoutes } from "@/lib/server/api/target-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET, PATCH, DELETE } = targetRoutes(sessionActor);
