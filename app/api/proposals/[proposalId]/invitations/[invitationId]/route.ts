import { invitationRoutes } from "@/lib/server/api/member-routes";
import { sessionActor } from "@/lib/server/session";

export const { DELETE } = invitationRoutes(sessionActor);
