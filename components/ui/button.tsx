import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "danger" | "ghost";

const STYLES: Record<Variant, string> = {
  primary: "bg-kerf-500 text-ink-950 hover:bg-kerf-400 disabled:bg-ink-700 disabled:text-ink-400",
  secondary: "bg-ink-800 text-ink-100 border border-ink-700 hover:bg-ink-700 disabled:text-ink-400",
  danger: "bg-danger-500 text-ink-950 hover:bg-danger-400 disabled:bg-ink-700",
  ghost: "text-ink-200 hover:bg-ink-800 hover:text-ink-100",
};

/** The app's one button style set. */
export function Button({ variant = "secondary", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type="button"
      {...props}
      className={`inline-flex items-center justify-center gap-1.5 rounded-md px-3 py-1.5 text-sm font-medium transition-colors disabled:cursor-not-allowed ${STYLES[variant]} ${className}`}
    />
  );
}
