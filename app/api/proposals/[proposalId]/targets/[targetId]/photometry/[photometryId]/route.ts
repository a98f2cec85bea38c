import { photometryFileRoutes } from "@/lib/server/api/photometry-routes";
import { sessionActor } from "@/lib/server/session";

export const { DELETE } = photometryFileRoutes(sessionActor);
