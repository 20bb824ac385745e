import { forwardRef, type InputHTMLAttributes, type TextareaHTMLAttributes } from "react";

const INPUT =
  "w-full rounded-md border border-ink-700 bg-ink-900 px-2.5 py-1.5 text-sm text-ink-100 placeholder:text-ink-400 focus:border-kerf-500 focus:outline-none aria-[invalid=true]:border-danger-500";

type Common = { label: string; error?: string; hint?: string; id: string };

/** A labelled text input with its error announced to screen readers. */
export const TextField = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement> & Common>(function TextField(
  { label, error, hint, id, className = "", ...props },
  ref,
) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-xs font-medium text-ink-300">
        {label}
      </label>
      <input ref={ref} id={id} aria-invalid={!!error} aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined} className={INPUT} {...props} />
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs text-ink-400">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} role="alert" className="text-xs text-danger-400">
          {error}
        </p>
      )}
    </div>
  );
});

/** A labelled multi-line text field. */
export const TextArea = forwardRef<HTMLTextAreaElement, TextareaHTMLAttributes<HTMLTextAreaElement> & Common>(function TextArea(
  { label, error, id, className = "", ...props },
  ref,
) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-xs font-medium text-ink-300">
        {label}
      </label>
      <textarea ref={ref} id={id} rows={3} aria-invalid={!!error} aria-describedby={error ? `${id}-error` : undefined} className={INPUT} {...props} />
      {error && (
        <p id={`${id}-error`} role="alert" className="text-xs text-danger-400">
          {error}
        </p>
      )}
    </div>
  );
});

/** A form-level message region (server refusals land here). */
export function FormMessage({ message }: { message?: string | null }) {
  return (
    <div aria-live="polite" className="min-h-5 text-sm text-danger-400">
      {message}
    </div>
  );
}
