import { z } from "zod";

/** Route parameters: every id is a UUID; anything else is a 404, like a missing record. */
export const proposalParamsSchema = z.object({ proposalId: z.uuid() });
export const targetParamsSchema = proposalParamsSchema.extend({ targetId: z.uuid() });
export const noteParamsSchema = targetParamsSchema.extend({ noteId: z.uuid() });
export const memberParamsSchema = proposalParamsSchema.extend({ userId: z.uuid() });
export const invitationParamsSchema = proposalParamsSchema.extend({ invitationId: z.uuid() });
