import { calendarRoutes } from "@/lib/exports/calendar/server";
import { sessionActor } from "@/lib/server/session";

export const { GET } = calendarRoutes(sessionActor);
