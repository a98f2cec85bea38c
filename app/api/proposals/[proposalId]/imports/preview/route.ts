import { importPreviewRoutes } from "@/lib/server/api/upload-routes";
import { sessionActor } from "@/lib/server/session";

export const { POST } = importPreviewRoutes(sessionActor);
