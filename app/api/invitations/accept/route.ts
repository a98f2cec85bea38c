import { acceptInvitationRoutes } from "@/lib/server/api/member-routes";
import { sessionActor } from "@/lib/server/session";

export const { POST } = acceptInvitationRoutes(sessionActor);
