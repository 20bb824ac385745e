import type { AlignmentModel } from "@/lib/alignment/fit";
import type { CompareMode } from "./compare-view";
import type { WorkMode } from "./work-mode";

/**
 * The die bench's work mode and an alignment session's unaccepted state, kept in the page's
 * search params so Back, Forward and reload do not lose them. Parameters of others (such as
 * `thread`) are left as they are.
 */
const KEYS = ["work", "moving", "fixed", "top", "bottom", "mode", "pairs", "pending", "model", "mirrored"] as const;
const MODES: readonly CompareMode[] = ["side_by_side", "overlay", "split"];
/** Links written before the modes were renamed still open the same view. */
const FORMER_MODES: Readonly<Record<string, CompareMode>> = { blend: "overlay", swipe: "split" };
const ID = /^[0-9a-f-]{36}$/i;

/** The work mode the params describe; anything malformed reads as the single view. */
export function workModeFromParams(p: URLSearchParams): WorkMode {
  const id = (k: string) => (ID.test(p.get(k) ?? "") ? p.get(k)! : null);
  if (p.get("work") === "align" && id("moving") && id("fixed")) return { kind: "align", movingId: id("moving")!, fixedId: id("fixed")! };
  const raw = p.get("mode") ?? "";
  const mode = (FORMER_MODES[raw] ?? raw) as CompareMode;
  if (p.get("work") === "compare" && id("top") && id("bottom") && MODES.includes(mode))
    return { kind: "compare", topId: id("top")!, bottomId: id("bottom")!, mode };
  return { kind: "view" };
}

/** `params` with the work mode written in (and a previous session's keys removed). */
export function paramsWithWorkMode(params: URLSearchParams, w: WorkMode): URLSearchParams {
  const p = new URLSearchParams(params);
  for (const k of KEYS) p.delete(k);
  if (w.kind === "align") {
    p.set("work", "align");
    p.set("moving", w.movingId);
    p.set("fixed", w.fixedId);
  } else if (w.kind === "compare") {
    p.set("work", "compare");
    p.set("top", w.topId);
    p.set("bottom", w.bottomId);
    p.set("mode", w.mode);
  }
  return p;
}

/** What an alignment session keeps in the URL: image px of each pair on the new and the aligned micrograph. */
export type SessionInUrl = {
  pairs: { imagePx: [number, number]; fixedPx: [number, number] }[];
  pending: [number, number] | null;
  model: AlignmentModel | null;
  mirrored: boolean;
};

// Two decimals of an image px are far below what a click resolves.
const num = (v: number) => String(Math.round(v * 100) / 100);
const nums = (s: string, n: number): number[] | null => {
  const v = s.split(",").map(Number);
  return v.length === n && v.every(Number.isFinite) ? v : null;
};

/** The session stored in the params, or null when they hold none (or a malformed one). */
export function sessionFromParams(p: URLSearchParams): SessionInUrl | null {
  const raw = p.get("pairs");
  if (raw === null) return null;
  const pairs: SessionInUrl["pairs"] = [];
  for (const part of raw ? raw.split(";") : []) {
    const v = nums(part, 4);
    if (!v) return null;
    pairs.push({ imagePx: [v[0], v[1]], fixedPx: [v[2], v[3]] });
  }
  const pend = p.get("pending") ? nums(p.get("pending")!, 2) : null;
  const model = p.get("model");
  return {
    pairs,
    pending: pend ? [pend[0], pend[1]] : null,
    model: model === "affine" || model === "similarity" ? model : null,
    mirrored: p.get("mirrored") === "1",
  };
}

/** `params` with the session written in. */
export function paramsWithSession(params: URLSearchParams, s: SessionInUrl): URLSearchParams {
  const p = new URLSearchParams(params);
  p.set("pairs", s.pairs.map((q) => [...q.imagePx, ...q.fixedPx].map(num).join(",")).join(";"));
  if (s.pending) p.set("pending", s.pending.map(num).join(","));
  else p.delete("pending");
  if (s.model) p.set("model", s.model);
  else p.delete("model");
  if (s.mirrored) p.set("mirrored", "1");
  else p.delete("mirrored");
  return p;
}
