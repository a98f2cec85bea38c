import { technicalSummaryRoutes } from "@/lib/server/api/export-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = technicalSummaryRoutes(sessionActor);
