import { noteCollectionRoutes } from "@/lib/server/api/target-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET, POST } = noteCollectionRoutes(sessionActor);
