import { useId } from "react";
import type { Caution } from "@/lib/safety/cautions";

/** A safety caution beside the work it concerns: calm text with an amber edge, never an alarm. */
export function CautionNote({ caution, className = "" }: { caution: Caution; className?: string }) {
  const id = useId();
  return (
    <div role="note" aria-labelledby={id} className={`rounded-md border border-ink-700 border-l-4 border-l-amber-400 bg-ink-850 p-3 ${className}`}>
      <p id={id} className="mb-1 text-xs font-semibold text-amber-200">
        Caution: {caution.title}
      </p>
      <p className="text-xs leading-relaxed text-ink-200">{caution.text}</p>
    </div>
  );
}
