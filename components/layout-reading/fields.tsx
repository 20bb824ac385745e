"use client";

/** Compact labelled inputs for the reading panels (numbers typed as text, parsed by the caller). */
const CONTROL =
  "w-full rounded border border-ink-700 bg-ink-950 px-1.5 py-1 text-sm text-ink-100 focus:border-kerf-500 focus:outline-none disabled:text-ink-400";

/** A number typed as text; empty or unparsable text reaches the formula as NaN and is reported by name. */
export function NumberInput({
  id,
  label,
  value,
  onChange,
  unit,
  disabled,
}: {
  id: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  unit?: string;
  disabled?: boolean;
}) {
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-[11px] font-medium text-ink-300">
        {label}
        {unit ? ` (${unit})` : ""}
      </label>
      <input id={id} inputMode="decimal" value={value} disabled={disabled} onChange={(e) => onChange(e.target.value)} className={CONTROL} />
    </div>
  );
}

/** A choice among fixed options. */
export function SelectInput<T extends string>({
  id,
  label,
  value,
  options,
  onChange,
}: {
  id: string;
  label: string;
  value: T;
  options: readonly (readonly [T, string])[];
  onChange: (v: T) => void;
}) {
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-[11px] font-medium text-ink-300">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value as T)} className={CONTROL}>
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
    </div>
  );
}

/** A value read off the shape, shown but not typed. */
export function ReadOnlyValue({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="flex flex-col gap-0.5">
      <span className="text-[11px] font-medium text-ink-300">{label}</span>
      <span data-testid={testId} className="py-1 text-sm tabular-nums text-ink-100">
        {value}
      </span>
    </div>
  );
}

/** Text typed into a number field → number; blank → NaN so the formula names the missing input. */
export function parseNumber(text: string): number {
  return text.trim() === "" ? Number.NaN : Number(text.replace(",", "."));
}
