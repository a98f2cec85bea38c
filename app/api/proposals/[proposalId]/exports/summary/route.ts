import { technicalSummaryRoutes } from "@/lib/exports/server/routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = technicalSummaryRoutes(sessionActor);
