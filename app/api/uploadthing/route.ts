import { createRouteHandler } from "uploadthing/next";
import { sessionActor } from "@/lib/server/session";
import { uploadRouter, withSignInCheck } from "@/lib/server/upload-router";

const handlers = createRouteHandler({ router: uploadRouter });

export const GET = handlers.GET;
export const POST = withSignInCheck(sessionActor, handlers.POST);
