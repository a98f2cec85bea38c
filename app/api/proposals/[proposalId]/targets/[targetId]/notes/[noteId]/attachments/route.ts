import { attachmentCollectionRoutes } from "@/lib/server/api/upload-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = attachmentCollectionRoutes(sessionActor);
