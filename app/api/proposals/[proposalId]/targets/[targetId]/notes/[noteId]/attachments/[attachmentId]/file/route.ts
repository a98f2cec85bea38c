import { attachmentFileRoutes } from "@/lib/server/api/upload-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = attachmentFileRoutes(sessionActor);
