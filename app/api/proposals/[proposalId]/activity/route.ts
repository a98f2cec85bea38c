import { activityRoutes } from "@/lib/server/api/proposal-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = activityRoutes(sessionActor);
