"use server";

import { AuthError } from "next-auth";
import { signIn } from "@/auth";
import { formTextProblem } from "@/lib/validation/unsafe-text";
import { database } from "@/server/database";
import { acceptInvitation } from "@/server/access/invitations";
import { AppError } from "@/lib/errors";
import { currentActor } from "@/server/http/session";
import { acceptInvitationSchema } from "@/lib/validation/review";

export type AcceptState = { ok: boolean; message?: string };

/** Accepts the invitation (a new person sets name and password), then signs in and opens the cases. */
export async function acceptInvitationAction(_prev: AcceptState, form: FormData): Promise<AcceptState> {
  const unsafe = formTextProblem(form);
  if (unsafe) return { ok: false, message: `Invalid form: ${unsafe}` };
  const raw = {
    token: String(form.get("token") ?? ""),
    name: form.get("name") ? String(form.get("name")) : undefined,
    password: form.get("password") ? String(form.get("password")) : undefined,
  };
  const parsed = acceptInvitationSchema.safeParse(raw);
  if (!parsed.success) return { ok: false, message: parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ") };
  let email: string;
  const actor = await currentActor();
  try {
    email = (await acceptInvitation(await database(), actor, parsed.data)).email;
  } catch (e) {
    if (e instanceof AppError) return { ok: false, message: e.message };
    throw e;
  }
  if (actor) return { ok: true, message: "You joined the team." };
  try {
    await signIn("credentials", { email, password: parsed.data.password, redirectTo: "/cases" });
    return { ok: true };
  } catch (e) {
    // signIn() throws a redirect on success: only Auth.js errors are ours to handle.
    if (!(e instanceof AuthError)) throw e;
    return { ok: true, message: "You joined the team; sign in with your new password." };
  }
}
