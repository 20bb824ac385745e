import type { PolygonGeometry, Position } from "@/lib/geometry/types";
import type { AnyShape, MarkupKind, PadProperties, Shape } from "@/lib/markup/types";
import { createEditor } from "./editor";
import type { Change } from "./model";
import { rectangleAround, rectangleGeometry } from "./rectangle";
import type { Editor, PointerInput } from "./types";

/**
 * Helpers for tool tests: an editor with predictable ids and times, pointer gestures in die µm,
 * and shapes from the invented NV-24R receiver die (2400 × 1600 µm). Not a test file itself.
 */

/** Hit tolerance used by the gestures, in µm (4 screen px at 0.5 µm per px). */
export const TOLERANCE_UM = 2;

export const TIME = "2025-03-04T09:00:00.000Z";

type Mods = { shift?: boolean; alt?: boolean; toleranceUm?: number };

const at = (x: number, y: number, mods: Mods = {}): PointerInput => ({
  x,
  y,
  toleranceUm: mods.toleranceUm ?? TOLERANCE_UM,
  shift: mods.shift ?? false,
  alt: mods.alt ?? false,
});

/** The polygon of a shape (or preview draft), failing the test when it has none. */
export function polygonOf(shape: { readonly geometry: { readonly type: string } } | undefined | null): PolygonGeometry {
  if (!shape || shape.geometry.type !== "Polygon") throw new Error("expected a polygon");
  return shape.geometry as PolygonGeometry;
}

/** A pad shape centred on (cx, cy). */
export function padShape(id: string, cx: number, cy: number, size = 80, properties: Partial<PadProperties> = {}): Shape<"pad"> {
  return {
    id,
    kind: "pad",
    geometry: rectangleAround([cx, cy], size, size),
    properties: { label: id.toUpperCase(), net: "", state: "bonded", ...properties },
    version: 1,
    createdBy: "analyst",
    updatedAt: TIME,
  };
}

/** A wire bond from its pad's centre to `to`. */
export function bondShape(id: string, pad: Shape<"pad">, to: Position): Shape<"wire_bond"> {
  const ring = pad.geometry.coordinates[0];
  const centre: Position = [(ring[0][0] + ring[2][0]) / 2, (ring[0][1] + ring[2][1]) / 2];
  return {
    id,
    kind: "wire_bond",
    geometry: { type: "LineString", coordinates: [centre, to] },
    properties: { diameterUm: 25, padId: pad.id },
    version: 1,
    createdBy: "analyst",
    updatedAt: TIME,
  };
}

/** A block with the given (open) outer ring. */
export function blockShape(id: string, ring: Position[], name = "LNA"): Shape<"block"> {
  return {
    id,
    kind: "block",
    geometry: { type: "Polygon", coordinates: [[...ring, ring[0]]] },
    properties: { name, function: "" },
    version: 1,
    createdBy: "analyst",
    updatedAt: TIME,
  };
}

/** A trace along the given centre line. */
export function traceShape(id: string, points: Position[], widthUm = 5): Shape<"trace"> {
  return {
    id,
    kind: "trace",
    geometry: { type: "LineString", coordinates: points },
    properties: { widthUm },
    version: 1,
    createdBy: "analyst",
    updatedAt: TIME,
  };
}

/** A die outline over [0, w] × [0, h]. */
export function outlineShape(id: string, w = 2400, h = 1600): Shape<"die_outline"> {
  return {
    id,
    kind: "die_outline",
    geometry: rectangleGeometry({ minX: 0, minY: 0, maxX: w, maxY: h }),
    properties: {},
    version: 1,
    createdBy: "analyst",
    updatedAt: TIME,
  };
}

/** An editor with ids "n1", "n2", … and one fixed time, plus gestures and a log of commits. */
export function setup(options: { shapes?: AnyShape[]; canEdit?: boolean } = {}) {
  let counter = 0;
  const editor: Editor = createEditor({
    shapes: options.shapes ?? [],
    canEdit: options.canEdit ?? true,
    newId: () => `n${++counter}`,
    now: () => TIME,
    userId: "analyst",
  });
  const commits: (readonly Change[])[] = [];
  editor.onCommit((entry) => commits.push(entry));
  const state = () => editor.getState();
  return {
    editor,
    commits,
    state,
    shape: (id: string) => state().shapes.get(id),
    ofKind: <K extends MarkupKind>(kind: K) => state().shapeList.filter((s): s is Extract<AnyShape, { kind: K }> => s.kind === kind),
    selected: () => [...state().selection],
    down: (x: number, y: number, mods?: Mods) => editor.pointerDown(at(x, y, mods)),
    move: (x: number, y: number, mods?: Mods) => editor.pointerMove(at(x, y, mods)),
    up: (x: number, y: number, mods?: Mods) => editor.pointerUp(at(x, y, mods)),
    click(x: number, y: number, mods?: Mods) {
      editor.pointerDown(at(x, y, mods));
      editor.pointerUp(at(x, y, mods));
    },
    doubleClick(x: number, y: number, mods?: Mods) {
      for (let i = 0; i < 2; i++) {
        editor.pointerDown(at(x, y, mods));
        editor.pointerUp(at(x, y, mods));
      }
      editor.doubleClick(at(x, y, mods));
    },
    /** Press at `from`, move in a few steps, release at `to`. */
    drag(from: Position, to: Position, mods?: Mods) {
      editor.pointerDown(at(from[0], from[1], mods));
      for (const t of [0.25, 0.5, 1]) editor.pointerMove(at(from[0] + t * (to[0] - from[0]), from[1] + t * (to[1] - from[1]), mods));
      editor.pointerUp(at(to[0], to[1], mods));
    },
    key: (key: string, mods: { shift?: boolean; ctrl?: boolean; meta?: boolean; alt?: boolean } = {}) =>
      editor.keyDown({ key, shift: mods.shift ?? false, ctrl: mods.ctrl ?? false, meta: mods.meta ?? false, alt: mods.alt ?? false }),
  };
}
