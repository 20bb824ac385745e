import { applyAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { SimilarCandidateDto } from "@/lib/dto/find-similar";
import { HALO_COLOUR } from "@/lib/markup/palette";

/** Kept candidates: a bright dashed outline; dropped ones: dim, crossed out. */
const KEPT = "#9fe870";
const DROPPED = "rgba(255,120,120,0.8)";

/**
 * Draws the shown candidates over the markup: each die box as a dashed outline through the
 * die → screen matrix (so a turned micrograph turns them too) with its score above it.
 */
export function drawCandidates(
  ctx: CanvasRenderingContext2D,
  m: Affine2x3,
  shown: readonly { c: SimilarCandidateDto; i: number }[],
  dropped: ReadonlySet<number>,
) {
  ctx.save();
  ctx.font = "600 11px var(--font-inter), system-ui, sans-serif";
  ctx.textBaseline = "bottom";
  for (const { c, i } of shown) {
    const b = c.boxUm;
    const corners = [
      [b.x, b.y],
      [b.x + b.w, b.y],
      [b.x + b.w, b.y + b.h],
      [b.x, b.y + b.h],
    ].map(([x, y]) => applyAffine(m, x, y));
    const off = dropped.has(i);
    const path = () => {
      ctx.beginPath();
      corners.forEach(([x, y], k) => (k === 0 ? ctx.moveTo(x, y) : ctx.lineTo(x, y)));
      ctx.closePath();
    };
    ctx.setLineDash([]);
    ctx.lineWidth = 4;
    ctx.strokeStyle = HALO_COLOUR;
    path();
    ctx.stroke();
    ctx.setLineDash([6, 4]);
    ctx.lineWidth = 2;
    ctx.strokeStyle = off ? DROPPED : KEPT;
    path();
    ctx.stroke();
    if (off) {
      ctx.setLineDash([]);
      ctx.beginPath();
      ctx.moveTo(...corners[0]);
      ctx.lineTo(...corners[2]);
      ctx.moveTo(...corners[1]);
      ctx.lineTo(...corners[3]);
      ctx.stroke();
    }
    const top = corners.reduce((a, p) => (p[1] < a[1] ? p : a));
    const left = Math.min(...corners.map((p) => p[0]));
    const text = c.score.toFixed(2);
    ctx.lineWidth = 3;
    ctx.strokeStyle = HALO_COLOUR;
    ctx.setLineDash([]);
    ctx.strokeText(text, left, top[1] - 3);
    ctx.fillStyle = off ? DROPPED : KEPT;
    ctx.fillText(text, left, top[1] - 3);
  }
  ctx.restore();
}
