import { benchFigureRoutes } from "@/lib/exports/server/figure-routes";

export const { GET } = benchFigureRoutes();
