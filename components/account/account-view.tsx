"use client";

import { useState } from "react";
import { apiFetch } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { ROLE_LABELS } from "@/lib/auth/permissions";
import type { MeDto } from "@/lib/dto/teams";

const input = "mt-1 w-full rounded-md border border-ink-700 bg-ink-950 px-2 py-1.5 text-sm text-ink-100";

/** Leaves for the sign-in page once every session has ended (this one too). */
function toSignIn(reason: string) {
  // A full page load on purpose: every cached query and the session cookie must be dropped.
  // eslint-disable-next-line @next/next/no-location-assign-relative-destination
  window.location.assign(`/sign-in?ended=${reason}`);
}

function PasswordForm() {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const submit = async (e: React.FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const newPassword = String(form.get("newPassword") ?? "");
    if (newPassword !== String(form.get("repeat") ?? "")) return setError("The two new passwords differ.");
    setBusy(true);
    try {
      await apiFetch("/api/me/password", { method: "POST", body: { currentPassword: String(form.get("currentPassword") ?? ""), newPassword } });
      toSignIn("password");
    } catch (err) {
      setError(err instanceof Error ? err.message : String(err));
      setBusy(false);
    }
  };
  return (
    <form onSubmit={submit} aria-label="Change password" className="flex max-w-sm flex-col gap-3">
      <label className="text-sm text-ink-200">
        Current password
        <input name="currentPassword" type="password" required autoComplete="current-password" className={input} />
      </label>
      <label className="text-sm text-ink-200">
        New password
        <input name="newPassword" type="password" required minLength={8} maxLength={200} autoComplete="new-password" className={input} />
      </label>
      <label className="text-sm text-ink-200">
        New password again
        <input name="repeat" type="password" required minLength={8} maxLength={200} autoComplete="new-password" className={input} />
      </label>
      {error && (
        <p role="alert" className="text-sm text-danger-400">
          {error}
        </p>
      )}
      <Button type="submit" variant="primary" disabled={busy} className="self-start">
        Change password
      </Button>
    </form>
  );
}

/** The account page: who you are, your teams, your password and your sessions. */
export function AccountView({ me }: { me: MeDto }) {
  const [error, setError] = useState<string | null>(null);
  const everywhere = async () => {
    try {
      await apiFetch("/api/me/sessions", { method: "DELETE" });
      toSignIn("everywhere");
    } catch (err) {
      setError(err instanceof Error ? err.message : String(err));
    }
  };
  return (
    <div className="flex max-w-2xl flex-col gap-8">
      <section aria-label="Account" className="flex flex-col gap-1">
        <h1 className="text-xl font-semibold">Account</h1>
        <p className="text-sm text-ink-200">
          {me.user.name} · {me.user.email}
        </p>
        <ul className="mt-2 text-sm text-ink-300">
          {me.teams.map((t) => (
            <li key={t.id}>
              {t.name}: {ROLE_LABELS[t.role].toLowerCase()}
            </li>
          ))}
          {me.teams.length === 0 && <li>You are not in a team yet.</li>}
        </ul>
      </section>
      <section aria-label="Password" className="flex flex-col gap-3">
        <h2 className="text-base font-semibold">Password</h2>
        <p className="text-sm text-ink-300">Changing it signs you out on every device, this one included.</p>
        <PasswordForm />
      </section>
      <section aria-label="Sessions" className="flex flex-col gap-3">
        <h2 className="text-base font-semibold">Sessions</h2>
        <p className="text-sm text-ink-300">
          Ends every session of your account at once — on other computers, in other browsers and here — for example after using a shared machine or losing a
          laptop. Signing out also ends them all.
        </p>
        {error && (
          <p role="alert" className="text-sm text-danger-400">
            {error}
          </p>
        )}
        <Button variant="danger" onClick={everywhere} className="self-start">
          Sign out everywhere
        </Button>
      </section>
    </div>
  );
}
