import type { MarkupKind, PadState } from "@/lib/markup/types";

/**
 * Kerfline's own markup palette: one hue per kind, chosen to read on both bright-field (light,
 * yellow-green) and dark-field (near-black) micrographs, with a dark halo under every stroke.
 */
export const KIND_STYLE: Record<MarkupKind, { colour: string; label: string; dash?: number[] }> = {
  pad: { colour: "#ffcf5a", label: "Pad" },
  wire_bond: { colour: "#ff8a65", label: "Wire bond" },
  block: { colour: "#6fd3f5", label: "Block" },
  symmetry_axis: { colour: "#c59cff", label: "Symmetry axis", dash: [10, 6] },
  trace: { colour: "#7ee0a8", label: "Trace" },
  ruler: { colour: "#ffffff", label: "Ruler" },
  note: { colour: "#ff9fd0", label: "Note" },
  die_outline: { colour: "#d7dde2", label: "Die outline", dash: [4, 4] },
};

/** How a pad's state shows: bonded filled, probed dashed, unbonded hollow. */
export const PAD_STATE_STYLE: Record<PadState, { fillAlpha: number; dash?: number[]; label: string }> = {
  bonded: { fillAlpha: 0.35, label: "bonded (filled)" },
  probed: { fillAlpha: 0.12, dash: [5, 3], label: "probed (dashed)" },
  unbonded: { fillAlpha: 0, label: "unbonded (hollow)" },
};

export const SELECTION_COLOUR = "#ffffff";
export const HALO_COLOUR = "rgba(0,0,0,0.65)";
