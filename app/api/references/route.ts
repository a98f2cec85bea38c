import { referencesRoutes } from "@/lib/citations/bibtex-route";

export const { GET } = referencesRoutes();
