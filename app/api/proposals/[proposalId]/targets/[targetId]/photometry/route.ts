import { photometryCollectionRoutes } from "@/lib/server/api/photometry-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET, POST } = photometryCollectionRoutes(sessionActor);
