import { benchFigureRoutes } from "@/lib/server/api/figure-routes";
import { sessionActor } from "@/lib/server/session";

export const { GET } = benchFigureRoutes(sessionActor);
