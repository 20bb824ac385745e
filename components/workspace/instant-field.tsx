"use client";

import { useController, type Control, type FieldPath, type FieldValues } from "react-hook-form";

const pad = (n: number) => String(n).padStart(2, "0");

/** An ISO 8601 instant as the browser's `datetime-local` text (local time, minutes). */
function toLocalInput(iso: string | null | undefined): string {
  if (!iso) return "";
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return "";
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/**
 * A date and time typed in the browser's local time and kept in the form as the ISO 8601 UTC
 * instant the API takes (or null when empty), so the shared schema checks what is sent.
 */
export function InstantField<T extends FieldValues>({
  control,
  name,
  id,
  label,
  error,
  disabled,
}: {
  control: Control<T>;
  name: FieldPath<T>;
  id: string;
  label: string;
  error?: string;
  disabled?: boolean;
}) {
  const { field } = useController({ control, name });
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium text-ink-300">
        {label} <span className="font-normal text-ink-400">(local time)</span>
      </label>
      <input
        id={id}
        type="datetime-local"
        disabled={disabled}
        value={toLocalInput(field.value as string | null)}
        onChange={(e) => field.onChange(e.target.value ? new Date(e.target.value).toISOString() : null)}
        onBlur={field.onBlur}
        aria-invalid={!!error}
        aria-describedby={error ? `${id}-error` : undefined}
        className="w-full rounded-md border border-ink-700 bg-ink-900 px-2.5 py-1.5 text-sm text-ink-100 [color-scheme:dark] focus:border-kerf-500 focus:outline-none aria-[invalid=true]:border-danger-500"
      />
      {error && (
        <p id={`${id}-error`} role="alert" className="text-xs text-danger-400">
          {error}
        </p>
      )}
    </div>
  );
}
