import { openRing, polygonCentroid } from "../geometry/measure";
import type { PolygonGeometry } from "../geometry/types";
import { dieFrameFromOutline, toOutlineAxes, type DieFrame } from "./die-frame";
import { PadTableInputError } from "./pad-table-input-error";
import { alongSide, nearestSide, perimeterPosition, SIDES_CCW } from "./perimeter";
import type { PadInput, PadRow, PadSide, PadTable, PadTableOptions } from "./types";

const STATES = new Set(["bonded", "probed", "unbonded"]);
/** Slack at the die edge, in µm: a pad centred exactly on the outline is on the die. */
const EDGE_SLACK_UM = 1e-6;

type Placed = {
  readonly pad: PadInput;
  readonly side: PadSide;
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
  readonly along: number;
  readonly perimeter: number;
};

function checkPad(pad: PadInput): void {
  const ring = pad?.geometry?.type === "Polygon" ? pad.geometry.coordinates[0] : undefined;
  if (typeof pad?.id !== "string" || pad.id === "") throw new PadTableInputError("every pad needs an id");
  if (!ring || ring.length < 3 || !ring.flat().every(Number.isFinite)) {
    throw new PadTableInputError(`pad ${pad.id} must be a Polygon with finite coordinates`);
  }
  if (!STATES.has(pad.properties?.state)) throw new PadTableInputError(`pad ${pad.id} has an unknown state`);
}

function place(pad: PadInput, frame: DieFrame): Placed {
  const { widthUm: w, heightUm: h } = frame;
  const [x, y] = toOutlineAxes(frame, polygonCentroid(pad.geometry));
  const local = openRing(pad.geometry.coordinates[0]).map((p) => toOutlineAxes(frame, p));
  const xs = local.map((p) => p[0]);
  const ys = local.map((p) => p[1]);
  const side = nearestSide([x, y], w, h);
  return {
    pad,
    side,
    x,
    y,
    width: Math.max(...xs) - Math.min(...xs),
    height: Math.max(...ys) - Math.min(...ys),
    along: alongSide(side, [x, y], w, h),
    perimeter: perimeterPosition(side, [x, y], w, h),
  };
}

/** Counter-clockwise order from the top-left corner; stacked pads by travel, then id. */
function byPerimeter(a: Placed, b: Placed): number {
  return a.perimeter - b.perimeter || a.along - b.along || (a.pad.id < b.pad.id ? -1 : a.pad.id > b.pad.id ? 1 : 0);
}

function padOneIndex(ordered: readonly Placed[], options: PadTableOptions): number {
  if (ordered.length === 0) {
    if (options.padOneId !== undefined) throw new PadTableInputError(`pad 1 "${options.padOneId}" is not among the pads`);
    return 0;
  }
  if (options.padOneId !== undefined) {
    const index = ordered.findIndex((p) => p.pad.id === options.padOneId);
    if (index < 0) throw new PadTableInputError(`pad 1 "${options.padOneId}" is not among the pads`);
    return index;
  }
  const flagged = ordered.flatMap((p, i) => (p.pad.properties.isPadOne ? [i] : []));
  if (flagged.length > 1) throw new PadTableInputError("more than one pad is marked as pad 1");
  // Default: the first pad counter-clockwise from the top-left corner, which is the topmost
  // pad on the left edge when that edge has pads (the usual package convention; common practice).
  return flagged[0] ?? 0;
}

/** Pitch to the next pad on the same side, counter-clockwise; null for the last on its side. */
function pitches(ordered: readonly Placed[]): Map<Placed, number | null> {
  const out = new Map<Placed, number | null>();
  for (const side of SIDES_CCW) {
    const onSide = ordered.filter((p) => p.side === side);
    onSide.forEach((p, i) => out.set(p, i + 1 < onSide.length ? Math.abs(onSide[i + 1].along - p.along) : null));
  }
  return out;
}

function summarise(rows: readonly PadRow[]): PadTable["summary"] {
  const padsPerSide: Record<PadSide, number> = { N: 0, E: 0, S: 0, W: 0 };
  rows.forEach((r) => padsPerSide[r.side]++);
  const pitchValues = rows.flatMap((r) => (r.pitchUm === null ? [] : [r.pitchUm]));
  return {
    padsPerSide,
    minPitchUm: pitchValues.length > 0 ? Math.min(...pitchValues) : null,
    probedNotBonded: rows.filter((r) => r.state === "probed").map(({ number, id, label }) => ({ number, id, label })),
  };
}

/**
 * Builds the pad table: pads numbered counter-clockwise around the die (seen in the die frame,
 * y up: left edge going down, bottom going right, right going up, top going left) starting from
 * pad 1, each with its side, centre, size and pitch, in the die outline's own axes.
 * @param dieOutline a rectangle in die µm, axis-aligned or rotated
 * @param options.padOneId the pad to number 1 (else a pad flagged isPadOne, else the topmost on the left edge)
 */
export function buildPadTable(pads: readonly PadInput[], dieOutline: PolygonGeometry, options: PadTableOptions = {}): PadTable {
  const frame = dieFrameFromOutline(dieOutline);
  pads.forEach(checkPad);
  const ids = new Set(pads.map((p) => p.id));
  if (ids.size !== pads.length) throw new PadTableInputError("pad ids must be unique");
  const placed = pads.map((p) => place(p, frame));
  // A pad whose centre is off the die (a slip of the pointer, a pad of the package) would take
  // a place in the perimeter order and renumber the table: it is listed apart unless asked for.
  const off = (p: Placed) =>
    !p.pad.properties.numberOutside &&
    (p.x < -EDGE_SLACK_UM || p.y < -EDGE_SLACK_UM || p.x > frame.widthUm + EDGE_SLACK_UM || p.y > frame.heightUm + EDGE_SLACK_UM);
  const ordered = placed.filter((p) => !off(p)).sort(byPerimeter);
  const outsideDie = placed.filter(off).map((p) => ({ id: p.pad.id, label: p.pad.properties.label, xUm: p.x, yUm: p.y }));
  const start = padOneIndex(ordered, options);
  const numbered = [...ordered.slice(start), ...ordered.slice(0, start)];
  const pitch = pitches(ordered);
  const rows = numbered.map((p, i): PadRow => ({
    number: i + 1,
    id: p.pad.id,
    label: p.pad.properties.label,
    net: p.pad.properties.net,
    state: p.pad.properties.state,
    side: p.side,
    xUm: p.x,
    yUm: p.y,
    xFromCentreUm: p.x - frame.widthUm / 2,
    yFromCentreUm: p.y - frame.heightUm / 2,
    widthUm: p.width,
    heightUm: p.height,
    pitchUm: pitch.get(p) ?? null,
  }));
  return {
    die: { widthUm: frame.widthUm, heightUm: frame.heightUm, rotationDeg: frame.rotationDeg },
    rows,
    outsideDie,
    summary: summarise(rows),
  };
}
