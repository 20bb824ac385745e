import { applyAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { OverlayDrawer } from "@/components/annotate/markup-overlay";

/** Pin colours of our own: open threads warm, resolved ones muted. */
const OPEN = "#f2a93b";
const RESOLVED = "#7fa88a";

/** Draws a numbered pin at each thread's anchor, in screen px through the die → screen matrix. */
export function threadPinsDrawer(
  pins: readonly { id: string; pin: readonly [number, number]; status: "open" | "resolved" }[],
  selectedId: string | null,
): OverlayDrawer {
  return (ctx: CanvasRenderingContext2D, matrix: Affine2x3) => {
    ctx.save();
    pins.forEach((t, i) => {
      const [x, y] = applyAffine(matrix, t.pin[0], t.pin[1]);
      if (!Number.isFinite(x) || !Number.isFinite(y)) return;
      const r = t.id === selectedId ? 11 : 8;
      ctx.beginPath();
      ctx.moveTo(x, y);
      ctx.arc(x, y - r - 4, r, Math.PI * 0.75, Math.PI * 2.25);
      ctx.closePath();
      ctx.fillStyle = t.status === "open" ? OPEN : RESOLVED;
      ctx.strokeStyle = t.id === selectedId ? "#ffffff" : "#1a1a1a";
      ctx.lineWidth = 1.5;
      ctx.fill();
      ctx.stroke();
      ctx.fillStyle = "#1a1a1a";
      ctx.font = "bold 10px sans-serif";
      ctx.textAlign = "center";
      ctx.textBaseline = "middle";
      ctx.fillText(String(i + 1), x, y - r - 4);
    });
    ctx.restore();
  };
}
