import { calendarRoutes } from "@/lib/server/api/export-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = calendarRoutes(sessionActor);
