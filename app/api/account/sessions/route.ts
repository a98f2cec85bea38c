import { sessionRoutes } from "@/lib/server/api/account-routes";
import { sessionActor } from "@/lib/server/session";

export const { DELETE } = sessionRoutes(sessionActor);
