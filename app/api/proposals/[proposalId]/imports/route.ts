import { importCollectionRoutes } from "@/lib/server/api/upload-routes";
import { sessionActor } from "@/lib/server/session";

export const { POST } = importCollectionRoutes(sessionActor);
