import { accountRoutes } from "@/lib/server/api/admin-routes";
import { sessionActor } from "@/lib/server/session";

export const { PATCH } = accountRoutes(sessionActor);
