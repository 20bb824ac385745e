import type { Position } from "../geometry/types";
import type { NewShapeInput } from "../validation/markup";
import type { DieLayout, DieSide, Pad, Trace } from "./layout-types";
import { rect } from "./layout-geometry";

/**
 * The markup an analyst would draw on a demo die that is read completely, taken from its
 * layout (the ground truth the micrographs are rendered from), in die µm: the die outline,
 * every pad with its label, net and state, a wire bond on each bonded pad, the circuit stages
 * and their support blocks, the differential axis, the RF and IF lines with the peaking
 * meanders, three rulers and a note on the die's marking. The demo seed stores it on die B so a
 * newcomer sees a finished reading before drawing one.
 */

/** A shape ready for the markup table: what POST /api/dies/{id}/markup accepts, with its id. */
export type LayoutShape = NewShapeInput & { readonly id: string };

const SIDE: Readonly<Record<DieSide, "N" | "E" | "S" | "W">> = { top: "N", right: "E", bottom: "S", left: "W" };

/** Blocks drawn: the three stages and the blocks beside them (the LNA's input pairs sit inside the LNA and are left out). */
const BLOCK_NAMES = ["LNA", "Mixer", "IF buffer", "LO buffer P", "LO buffer N", "Bias A", "Bias B"] as const;

/**
 * Routes drawn, with the name the marked die shows (the layout names a mirrored route "… (lower)").
 * The short IF output lines are left out: their labels would sit on the IF pads' labels.
 */
const ROUTE_LABELS: Readonly<Record<string, string>> = {
  "RF input P": "RF input P",
  "RF input P (lower)": "RF input N",
};

/** A mutable [x, y] pair, as the zod schema's output types it. */
type Pair = [number, number];
const ring = (points: readonly Position[]): Pair[][] => [points.map(([x, y]): Pair => [x, y])];
const line = (points: readonly Position[]): Pair[] => points.map(([x, y]): Pair => [x, y]);

function padRect(pad: Pad): Position[] {
  const [x, y] = pad.centreUm;
  const [w, h] = pad.sizeUm;
  return rect(x - w / 2, y - h / 2, x + w / 2, y + h / 2);
}

function findOrThrow<T>(items: readonly T[], test: (t: T) => boolean, what: string): T {
  const found = items.find(test);
  if (!found) throw new Error(`the layout has no ${what}`);
  return found;
}

function traces(layout: DieLayout): LayoutShape[] {
  const chosen: { trace: Trace; label: string }[] = [
    ...layout.meanders.map((trace) => ({ trace, label: trace.name })),
    ...layout.routes.filter((r) => r.name in ROUTE_LABELS).map((trace) => ({ trace, label: ROUTE_LABELS[trace.name] })),
  ];
  return chosen.map(({ trace, label }) => ({
    id: "",
    kind: "trace",
    geometry: { type: "LineString", coordinates: line(trace.pointsUm) },
    properties: { label, widthUm: trace.widthUm },
  }));
}

/**
 * Rulers an analyst takes first: the die width (just inside the bottom pad row, where its label
 * meets no other), the pitch of the left ground–signal pads (beside the pad column) and the
 * outer diameter of the spiral L1 (just under it).
 */
function rulers(layout: DieLayout): LayoutShape[] {
  const [dieW] = layout.dieSizeUm;
  const g1 = findOrThrow(layout.pads, (p) => p.label === "G1", "pad G1");
  const rf = findOrThrow(layout.pads, (p) => p.label === "RFIN_P", "pad RFIN_P");
  const l1 = findOrThrow(layout.spirals, (s) => s.name === "L1", "spiral L1");
  const besidePads = g1.centreUm[0] + g1.sizeUm[0] / 2 + 40;
  const bottomPad = findOrThrow(layout.pads, (p) => p.side === "bottom", "bottom pad");
  const aboveBottomPads = bottomPad.centreUm[1] + bottomPad.sizeUm[1] / 2 + 30;
  const underL1 = l1.centreUm[1] - l1.outerDiameterUm / 2 - 20;
  const r = l1.outerDiameterUm / 2;
  const spans: [string, Pair, Pair][] = [
    ["Die width", [0, aboveBottomPads], [dieW, aboveBottomPads]],
    ["GSG pitch", [besidePads, g1.centreUm[1]], [besidePads, rf.centreUm[1]]],
    ["L1 outer diameter", [l1.centreUm[0] - r, underL1], [l1.centreUm[0] + r, underL1]],
  ];
  return spans.map(([label, a, b]) => ({ id: "", kind: "ruler", geometry: { type: "LineString", coordinates: [a, b] }, properties: { label } }));
}

/**
 * The complete markup of `layout`. Ids come from `newId` (random by default), so the wire bonds
 * can name their pads. Pad states: a bonded pad carries its wire bond and so shows bonded; an
 * unbonded one has none; a probed one is set by hand, as probing cannot be seen from the bonds.
 */
export function layoutMarkup(layout: DieLayout, newId: () => string = () => crypto.randomUUID()): LayoutShape[] {
  const [w, h] = layout.dieSizeUm;
  const padIds = new Map(layout.pads.map((p) => [p.label, newId()]));
  const pads: LayoutShape[] = layout.pads.map((p) => ({
    id: padIds.get(p.label)!,
    kind: "pad",
    geometry: { type: "Polygon", coordinates: ring(padRect(p)) },
    properties: { label: p.label, net: p.net, state: p.state, side: SIDE[p.side], ...(p.state === "probed" ? { stateByHand: true } : {}) },
  }));
  const bonds: LayoutShape[] = layout.wireBonds.map((b) => ({
    id: "",
    kind: "wire_bond",
    geometry: { type: "LineString", coordinates: line([b.fromUm, b.toUm]) },
    properties: { diameterUm: b.diameterUm, padId: padIds.get(b.pad)! },
  }));
  const blocks: LayoutShape[] = BLOCK_NAMES.map((name) => {
    const block = findOrThrow(layout.blocks, (b) => b.name === name, `block ${name}`);
    return { id: "", kind: "block", geometry: { type: "Polygon", coordinates: ring(block.polygonUm) }, properties: { name, function: block.function } };
  });
  const axisY = layout.symmetryAxisYUm;
  const axis: LayoutShape = {
    id: "",
    kind: "symmetry_axis",
    geometry: {
      type: "LineString",
      coordinates: [
        [0, axisY],
        [w, axisY],
      ],
    },
    properties: { name: "Differential axis" },
  };
  const mask = findOrThrow(layout.textMarks, (m) => m.kind === "mask_id", "mask id text");
  const date = findOrThrow(layout.textMarks, (m) => m.kind === "date_code", "date code text");
  // Pinned just below the marks, where its label meets neither them nor the VCC2 line.
  const note: LayoutShape = {
    id: "",
    kind: "note",
    geometry: { type: "Point", coordinates: [date.positionUm[0] + 80, date.positionUm[1] - 75] },
    properties: { text: `Marking: ${mask.text}, date code ${date.text}` },
  };
  const outline: LayoutShape = {
    id: "",
    kind: "die_outline",
    geometry: { type: "Polygon", coordinates: ring(rect(0, 0, w, h)) },
    properties: { label: "Die edge" },
  };
  return [outline, ...pads, ...bonds, ...blocks, axis, ...traces(layout), ...rulers(layout), note].map((s) => (s.id ? s : { ...s, id: newId() }));
}
