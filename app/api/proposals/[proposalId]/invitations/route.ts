import { invitationCollectionRoutes } from "@/lib/server/api/member-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET, POST } = invitationCollectionRoutes(sessionActor);
