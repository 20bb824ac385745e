import "server-only";
import type { Database } from "@/db/client";
import type { Actor } from "@/server/access/context";
import { loadMicrograph } from "@/server/access/micrographs";
import { assertSearchable } from "@/server/access/image-searches";
import { micrographPixels } from "@/server/images/find-similar/pixels";
import { detectDieEdgeOf } from "@/server/images/find-similar/die-edge";
import { applyAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { DieEdgeDto } from "@/lib/dto/find-similar";

/**
 * Proposes a die outline from a micrograph's edge structure: corners in its pixels and, through
 * its transform, in the die frame (counter-clockwise from the lower-left). Stores nothing: the
 * analyst accepts it as the die outline, which re-frames the die like a drawn one. Marking is
 * editing, so owners and analysts only; the micrograph must be tiled and in the die frame.
 */
export async function proposeDieEdge(db: Database, actor: Actor, micrographId: string): Promise<DieEdgeDto> {
  const { row } = await loadMicrograph(db, actor, micrographId, "edit");
  const m = assertSearchable(row);
  const src = await micrographPixels({ dieId: m.dieId, id: m.id, format: m.format, width: m.width, height: m.height });
  try {
    const { cornersPx, confidence } = await detectDieEdgeOf(src);
    const t = m.transform as Affine2x3;
    return { cornersPx, cornersUm: cornersPx.map(([x, y]) => applyAffine(t, x, y)), confidence };
  } finally {
    await src.close();
  }
}
