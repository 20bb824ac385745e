"use client";

import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { mentionQueryAt } from "@/lib/review/mentions";
import type { MemberDto } from "@/lib/dto/teams";

/** A box for a remark or a reply, with @mention autocomplete of the team's members. */
export function ReplyBox({
  members,
  label,
  submitLabel,
  onSubmit,
  initial = "",
  onCancel,
}: {
  members: readonly MemberDto[];
  label: string;
  submitLabel: string;
  onSubmit: (body: string) => Promise<unknown>;
  initial?: string;
  onCancel?: () => void;
}) {
  const [text, setText] = useState(initial);
  const [caret, setCaret] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const area = useRef<HTMLTextAreaElement>(null);
  const q = mentionQueryAt(text, caret);
  const suggestions = q
    ? members.filter((m) => m.name.toLowerCase().startsWith(q.query.toLowerCase()) || m.email.toLowerCase().startsWith(q.query.toLowerCase())).slice(0, 6)
    : [];

  const choose = (m: MemberDto) => {
    if (!q) return;
    const next = `${text.slice(0, q.start)}@${m.name} ${text.slice(caret)}`;
    const pos = q.start + m.name.length + 2;
    setText(next);
    setCaret(pos);
    requestAnimationFrame(() => {
      area.current?.focus();
      area.current?.setSelectionRange(pos, pos);
    });
  };

  const submit = async () => {
    setBusy(true);
    setError(null);
    try {
      await onSubmit(text);
      setText("");
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="relative flex flex-col gap-1.5">
      <label className="text-xs text-ink-300">
        {label}
        <textarea
          ref={area}
          value={text}
          rows={3}
          onChange={(e) => {
            setText(e.target.value);
            setCaret(e.target.selectionStart);
          }}
          onSelect={(e) => setCaret(e.currentTarget.selectionStart)}
          className="mt-1 w-full rounded-md border border-ink-700 bg-ink-950 p-2 text-sm text-ink-100"
          placeholder="Write here; @ names a team member, `code`, - lists and links work"
        />
      </label>
      {suggestions.length > 0 && (
        <ul
          role="listbox"
          aria-label="Mention a team member"
          className="absolute left-0 top-full z-10 mt-1 w-64 rounded-md border border-ink-700 bg-ink-900 shadow-lg"
        >
          {suggestions.map((m) => (
            <li key={m.userId} role="option" aria-selected={false}>
              <button
                type="button"
                className="w-full px-2 py-1 text-left text-sm hover:bg-ink-800"
                onMouseDown={(e) => e.preventDefault()}
                onClick={() => choose(m)}
              >
                {m.name} <span className="text-xs text-ink-400">{m.email}</span>
              </button>
            </li>
          ))}
        </ul>
      )}
      {error && (
        <p role="alert" className="text-xs text-danger-400">
          {error}
        </p>
      )}
      <div className="flex gap-2">
        <Button variant="primary" disabled={busy || !text.trim()} onClick={submit}>
          {submitLabel}
        </Button>
        {onCancel && <Button onClick={onCancel}>Cancel</Button>}
      </div>
    </div>
  );
}
