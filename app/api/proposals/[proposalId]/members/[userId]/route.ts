import { memberRoutes } from "@/lib/server/api/member-routes";
import { sessionActor } from "@/lib/server/session";

export const { PATCH, DELETE } = memberRoutes(sessionActor);
