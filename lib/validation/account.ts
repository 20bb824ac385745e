import { z } from "zod";
import { uuidSchema } from "./common";

export const changePasswordSchema = z.strictObject({
  currentPassword: z.string().min(1, "must not be empty").max(200),
  newPassword: z.string().min(8, "must be at least 8 characters").max(200),
});

export const inboxItemParams = z.object({ itemId: uuidSchema });
export const myInvitationParams = z.object({ invitationId: uuidSchema });
