import { PROBING_CAUTION } from "@/lib/safety/cautions";
import { CautionNote } from "@/components/ui/caution-note";

/** A small disclosure beside probed pads: the caution for powered or high-voltage probing. */
export function ProbingCaution() {
  return (
    <details className="text-xs">
      <summary className="cursor-pointer text-amber-200 hover:underline">Probing caution</summary>
      <CautionNote caution={PROBING_CAUTION} className="mt-1" />
    </details>
  );
}
