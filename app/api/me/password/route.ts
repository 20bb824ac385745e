import { apiRoute, noContent } from "@/server/http/route";
import { changePassword } from "@/server/access/users";
import { changePasswordSchema } from "@/lib/validation/account";

/** `{ currentPassword, newPassword }`: changes the caller's password and ends all their sessions (204). */
export const POST = apiRoute({ body: changePasswordSchema }, async ({ db, actor, body }) => {
  await changePassword(db, actor, body);
  return noContent();
});
