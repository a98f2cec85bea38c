import { revisionUndoRoutes } from "@/lib/server/api/revision-routes";
import { sessionActor } from "@/lib/server/session";

export const { POST } = revisionUndoRoutes(sessionActor);
