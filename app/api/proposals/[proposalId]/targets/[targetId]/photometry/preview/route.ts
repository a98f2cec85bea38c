import { photometryPreviewRoutes } from "@/lib/server/api/photometry-routes";
import { sessionActor } from "@/lib/server/session";

export const { POST } = photometryPreviewRoutes(sessionActor);
