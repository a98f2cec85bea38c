import { attachmentRoutes } from "@/lib/server/api/upload-routes";
import { sessionActor } from "@/lib/server/session";

export const { DELETE } = attachmentRoutes(sessionActor);
