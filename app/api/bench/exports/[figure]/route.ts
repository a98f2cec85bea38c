import { benchFigureRoutes } from "@/lib/exports/server/figure-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = benchFigureRoutes(sessionActor);
