import type { SimilarCandidateDto } from "@/lib/dto/find-similar";
import type { Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { rectangleGeometry } from "../editor/rectangle";
import { newBlockProperties } from "../editor/shape-factory";
import type { DraftShape } from "../editor/types";

/** The candidates shown at a score threshold, with their index in the answer (for keep/drop). */
export function shownCandidates(candidates: readonly SimilarCandidateDto[], threshold: number): { c: SimilarCandidateDto; i: number }[] {
  return candidates.flatMap((c, i) => (c.score >= threshold ? [{ c, i }] : []));
}

/** The shown candidate under a die point (the smallest box holding it), or null. */
export function candidateAt(shown: readonly { c: SimilarCandidateDto; i: number }[], [x, y]: Position): number | null {
  let best: { i: number; area: number } | null = null;
  for (const { c, i } of shown) {
    const b = c.boxUm;
    const area = b.w * b.h;
    if (x >= b.x && x <= b.x + b.w && y >= b.y && y <= b.y + b.h && (!best || area < best.area)) best = { i, area };
  }
  return best?.i ?? null;
}

/**
 * New shapes for the kept candidates: the template's kind, the candidate's die box (the
 * template's own size, turned with it). Pads come unbonded and unlabelled, so the pad table
 * numbers them like any other; blocks get the next free names and the template's function.
 */
export function draftsFor(kept: readonly SimilarCandidateDto[], template: AnyShape, existing: Iterable<AnyShape>): DraftShape[] {
  const taken = [...existing];
  return kept.map((c) => {
    const geometry = rectangleGeometry({ minX: c.boxUm.x, minY: c.boxUm.y, maxX: c.boxUm.x + c.boxUm.w, maxY: c.boxUm.y + c.boxUm.h });
    if (template.kind !== "block") return { kind: "pad", geometry, properties: { label: "", net: "", state: "unbonded" } };
    const properties = { ...newBlockProperties(taken), function: template.properties.function };
    // The next name must see this one as taken.
    taken.push({ ...template, id: `draft-${taken.length}`, properties } as AnyShape);
    return { kind: "block", geometry, properties };
  });
}
