import { revisionCollectionRoutes } from "@/lib/server/api/revision-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET, POST } = revisionCollectionRoutes(sessionActor);
