import { proposalRoutes } from "@/lib/server/api/proposal-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET, PATCH, DELETE } = proposalRoutes(sessionActor);
