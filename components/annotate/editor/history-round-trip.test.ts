import type { Position } from "@/lib/geometry/types";
import { applyEntry } from "@/lib/markup/history";
import type { AnyShape } from "@/lib/markup/types";
import { describe, expect, it } from "vitest";
import { bondShape, blockShape, padShape, setup, traceShape } from "./editor-test-kit";

type Kit = ReturnType<typeof setup>;

/** mulberry32: a small seeded generator, so a failing sequence can be replayed. */
function random(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    int: (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1)),
    pick: <T>(items: readonly T[]): T | undefined => items[Math.floor(next() * items.length)],
  };
}
type Rng = ReturnType<typeof random>;

const model = (t: Kit) => [...t.state().shapes.values()].sort((a, b) => a.id.localeCompare(b.id));
const point = (r: Rng): Position => [r.int(0, 240) * 10, r.int(0, 160) * 10];
const centreOf = (s: AnyShape): Position => {
  const [x, y] =
    s.geometry.type === "Point" ? s.geometry.coordinates : s.geometry.type === "Polygon" ? s.geometry.coordinates[0][0] : s.geometry.coordinates[0];
  return s.geometry.type === "Polygon" ? [x + 5, y + 5] : [x, y];
};

/** User actions; each is one gesture or command, so it commits at most one entry. */
const actions: ((t: Kit, r: Rng) => void)[] = [
  (t, r) => {
    t.editor.select([r.pick(t.state().shapeList)?.id ?? ""]);
    t.editor.nudge(r.int(-20, 20), r.int(-20, 20));
  },
  (t, r) => {
    const shape = r.pick(t.state().shapeList);
    if (shape) t.drag(centreOf(shape), point(r));
  },
  (t, r) => {
    t.editor.select([r.pick(t.state().shapeList)?.id ?? ""]);
    t.key("Delete");
  },
  (t, r) => {
    t.editor.select(
      t
        .state()
        .shapeList.filter(() => r.int(0, 3) === 0)
        .map((s) => s.id),
    );
    t.key("d", { ctrl: true });
  },
  (t, r) => {
    t.key("p");
    if (r.int(0, 1)) t.click(...point(r));
    else t.drag(point(r), point(r));
  },
  (t, r) => {
    t.key("b");
    const [x, y] = point(r);
    for (const p of [
      [x, y],
      [x + r.int(5, 50) * 10, y],
      [x, y + r.int(5, 50) * 10],
    ] as Position[])
      t.click(...p);
    t.key("Enter");
  },
  (t, r) => {
    t.key("t");
    t.click(...point(r));
    t.doubleClick(...point(r));
  },
  (t, r) => {
    const pad = r.pick(t.ofKind("pad"));
    if (pad) t.editor.updateProperties(pad.id, { net: `n${r.int(0, 9)}`, state: r.pick(["bonded", "probed", "unbonded"] as const) });
  },
  (t, r) => {
    const pad = r.pick(t.ofKind("pad"));
    if (!pad) return;
    t.editor.select([pad.id]);
    t.drag(pad.geometry.coordinates[0][2] as Position, point(r));
  },
  (t, r) => {
    const block = r.pick(t.ofKind("block"));
    if (!block) return;
    t.editor.select([block.id]);
    const [a, b] = block.geometry.coordinates[0];
    t.click((a[0] + b[0]) / 2, (a[1] + b[1]) / 2, { alt: true });
  },
  (t, r) => {
    const pad = r.pick(t.ofKind("pad"));
    if (!pad) return;
    t.key("w");
    t.drag(centreOf(pad), point(r));
    t.key("s");
  },
  (t, r) => {
    t.key("x");
    t.click(...point(r), { shift: r.int(0, 1) === 1 });
    t.click(...point(r));
  },
  (t, r) => {
    t.key("o");
    t.drag(point(r), point(r));
  },
  (t, r) => {
    t.key("r");
    t.click(...point(r));
    t.click(...point(r));
    t.key(r.int(0, 1) ? "Enter" : "Escape");
  },
];

describe("undo and redo", () => {
  it("return the exact model over a sequence of 120 operations", () => {
    const vcc = padShape("vcc", 60, 1200);
    const vee = padShape("vee", 60, 400);
    const t = setup({
      shapes: [
        vcc,
        vee,
        bondShape("b1", vcc, [-300, 1200]),
        blockShape("lna", [
          [300, 300],
          [900, 300],
          [900, 700],
          [300, 700],
        ]),
        traceShape("l1", [
          [1000, 1000],
          [1400, 1000],
        ]),
      ],
    });
    // A mirror kept only from onCommit entries, as the persistence layer keeps the server: each
    // change's `before` must be what the mirror holds, and the mirror must end equal to the model.
    let mirror = new Map(t.state().shapes);
    t.editor.onCommit((entry) => {
      for (const c of entry) expect(c.before).toEqual(mirror.get((c.after ?? c.before)!.id) ?? null);
      mirror = applyEntry(mirror, entry, "forward");
    });
    const sorted = (m: ReadonlyMap<string, AnyShape>) => [...m.values()].sort((a, b) => a.id.localeCompare(b.id));
    const r = random(20240304);
    const past: AnyShape[][] = [];
    let future: AnyShape[][] = [];
    let undos = 0;
    for (let step = 0; step < 120; step++) {
      const before = model(t);
      const commits = t.commits.length;
      const roll = r.int(0, 9);
      if (roll === 0) {
        t.key("z", { ctrl: true });
        const expected = past.pop();
        if (expected) future.push(before);
        expect(model(t)).toEqual(expected ?? before);
        undos++;
      } else if (roll === 1) {
        t.key("y", { meta: true });
        const expected = future.pop();
        if (expected) past.push(before);
        expect(model(t)).toEqual(expected ?? before);
      } else {
        r.pick(actions)!(t, r);
        t.key("Escape");
        expect(t.commits.length - commits).toBeLessThanOrEqual(1);
        if (t.commits.length > commits) {
          past.push(before);
          future = [];
        }
      }
      expect(sorted(mirror)).toEqual(model(t));
    }
    expect(past.length).toBeGreaterThan(40);
    expect(undos).toBeGreaterThan(5);
    const end = model(t);
    const stack = [...past];
    while (stack.length > 0) {
      t.editor.undo();
      expect(model(t)).toEqual(stack.pop());
    }
    expect(t.state().canUndo).toBe(false);
    while (t.state().canRedo) t.editor.redo();
    expect(model(t)).toEqual(end);
    expect(sorted(mirror)).toEqual(end);
  });
});
