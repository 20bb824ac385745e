"use client";

import { useState } from "react";
import { apiFetch } from "@/lib/client/api";
import type { NotificationPrefs } from "@/lib/dto/notification-prefs";

const LABELS: Record<keyof NotificationPrefs, string> = {
  comment: "A reply on a remark I raised or replied to",
  mention: "Someone mentions me",
  review_submitted: "A die is sent to the checker (owners and reviewers)",
  review_decision: "A die I analysed is signed off, returned or withdrawn",
};

/** Which notification mails the user receives; each box saves at once. */
export function NotificationSettings({ initial }: { initial: NotificationPrefs }) {
  const [prefs, setPrefs] = useState(initial);
  const [error, setError] = useState<string | null>(null);
  const toggle = async (k: keyof NotificationPrefs, on: boolean) => {
    try {
      setPrefs(await apiFetch<NotificationPrefs>("/api/me/notifications", { method: "PATCH", body: { [k]: on } }));
      setError(null);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    }
  };
  return (
    <section aria-label="Notifications" className="flex max-w-lg flex-col gap-3">
      <h1 className="text-xl font-semibold">Notifications</h1>
      <p className="text-sm text-ink-300">Send me an e-mail when:</p>
      {(Object.keys(LABELS) as (keyof NotificationPrefs)[]).map((k) => (
        <label key={k} className="flex items-center gap-2 text-sm text-ink-200">
          <input type="checkbox" checked={prefs[k]} onChange={(e) => toggle(k, e.target.checked)} className="accent-kerf-500" /> {LABELS[k]}
        </label>
      ))}
      {error && (
        <p role="alert" className="text-sm text-danger-400">
          {error}
        </p>
      )}
    </section>
  );
}
