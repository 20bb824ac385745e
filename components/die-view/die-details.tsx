import type { DieDto } from "@/lib/dto/dies";
import { formatUm } from "@/lib/units/format-um";

/** The die's size, analyst and notes, in the side panel. */
export function DieDetails({ die, umPerPx = null }: { die: DieDto; umPerPx?: number | null }) {
  return (
    <section aria-label="Die details">
      <h2 className="text-base font-semibold">{die.name}</h2>
      <dl className="mt-3 grid grid-cols-2 gap-3 text-sm">
        <div>
          <dt className="text-xs uppercase text-ink-400">Width</dt>
          <dd>{die.widthUm ? `${formatUm(die.widthUm, umPerPx)} µm` : "not known"}</dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-400">Height</dt>
          <dd>{die.heightUm ? `${formatUm(die.heightUm, umPerPx)} µm` : "not known"}</dd>
        </div>
        <div className="col-span-2">
          <dt className="text-xs uppercase text-ink-400">Analyst</dt>
          <dd>{die.analystName ?? "—"}</dd>
        </div>
      </dl>
      {die.notes && <p className="mt-3 whitespace-pre-wrap text-sm text-ink-200">{die.notes}</p>}
    </section>
  );
}
