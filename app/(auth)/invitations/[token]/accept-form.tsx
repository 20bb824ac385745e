"use client";

import Link from "next/link";
import { useActionState } from "react";
import { acceptInvitationAction, type AcceptState } from "./actions";

const input = "mt-1 w-full rounded-md border border-ink-700 bg-ink-950 px-2 py-1.5 text-sm text-ink-100";

/** The invitation form: name and password for a new account, or one button when signed in. */
export function AcceptForm({ token, needsAccount }: { token: string; needsAccount: boolean }) {
  const [state, action, pending] = useActionState<AcceptState, FormData>(acceptInvitationAction, { ok: false });
  if (state.ok && state.message) {
    return (
      <p role="status" className="text-sm text-ink-200">
        {state.message}{" "}
        <Link href="/cases" className="text-kerf-300 underline">
          Open the cases
        </Link>
      </p>
    );
  }
  return (
    <form action={action} className="flex flex-col gap-3">
      <input type="hidden" name="token" value={token} />
      {needsAccount && (
        <>
          <label className="text-sm text-ink-200">
            Your name
            <input name="name" required maxLength={120} className={input} autoComplete="name" />
          </label>
          <label className="text-sm text-ink-200">
            Choose a password
            <input name="password" type="password" required minLength={8} className={input} autoComplete="new-password" />
          </label>
        </>
      )}
      <div aria-live="polite">
        {state.message && (
          <p role="alert" className="text-sm text-danger-400">
            {state.message}
          </p>
        )}
      </div>
      <button type="submit" disabled={pending} className="rounded-md bg-kerf-500 px-3 py-1.5 text-sm font-medium text-ink-950 hover:bg-kerf-400">
        {needsAccount ? "Join the team" : "Accept the invitation"}
      </button>
    </form>
  );
}
