import { accountRoutes } from "@/lib/server/api/account-routes";

export const POST = accountRoutes.reset;
