"use server";

import { AuthError } from "next-auth";
import { signIn } from "@/auth";
import { formTextProblem } from "@/lib/validation/unsafe-text";

export type SignInState = { ok: boolean; message?: string };

/** Signs in with e-mail and password; returns a message the form shows on failure. */
export async function signInAction(_prev: SignInState, form: FormData): Promise<SignInState> {
  const unsafe = formTextProblem(form);
  if (unsafe) return { ok: false, message: `Invalid form: ${unsafe}` };
  const email = String(form.get("email") ?? "");
  const password = String(form.get("password") ?? "");
  const next = String(form.get("next") ?? "/cases");
  if (!email || !password) return { ok: false, message: "Enter your e-mail and password." };
  try {
    await signIn("credentials", { email, password, redirectTo: next.startsWith("/") && !next.startsWith("//") ? next : "/cases" });
    return { ok: true };
  } catch (e) {
    // signIn() throws a redirect on success: only Auth.js errors are ours to handle.
    if (!(e instanceof AuthError)) throw e;
    const code = (e as AuthError & { code?: string }).code ?? "";
    if (code.startsWith("too_many_attempts:")) {
      const minutes = code.split(":")[1];
      return { ok: false, message: `Too many attempts, try again in ${minutes} minute${minutes === "1" ? "" : "s"}.` };
    }
    return { ok: false, message: "That e-mail and password do not match an account." };
  }
}
