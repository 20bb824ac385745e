"use client";

import { useActionState } from "react";
import { signInAction, type SignInState } from "./actions";
import { TextField, FormMessage } from "@/components/ui/field";

export function SignInForm({ next }: { next: string }) {
  const [state, action, pending] = useActionState<SignInState, FormData>(signInAction, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-3">
      <h1 className="text-lg font-semibold">Sign in</h1>
      <input type="hidden" name="next" value={next} />
      <TextField id="email" name="email" type="email" label="E-mail" autoComplete="username" required autoFocus />
      <TextField id="password" name="password" type="password" label="Password" autoComplete="current-password" required />
      <FormMessage message={state.message} />
      <button
        type="submit"
        disabled={pending}
        className="rounded-md bg-kerf-500 px-3 py-2 text-sm font-semibold text-ink-950 hover:bg-kerf-400 disabled:bg-ink-700"
      >
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
