import { z } from "zod";

/** Route parameters: every id is a UUID; anything else is a 404, like a missing record. */
export const proposalParamsSchema = z.object({ proposalId: z.uuid("The proposal names nothing here.") });
export const targetParamsSchema = proposalParamsSchema.extend({ targetId: z.uuid("The target names nothing here.") });
export const noteParamsSchema = targetParamsSchema.extend({ noteId: z.uuid("The note names nothing here.") });
export const memberParamsSchema = proposalParamsSchema.extend({ userId: z.uuid("The member names nobody here.") });
export const invitationParamsSchema = proposalParamsSchema.extend({ invitationId: z.uuid("The invitation names nothing here.") });
