import { describe, expect, it } from "vitest";
import type { AnyShape } from "@/lib/markup/types";
import { labelBox, labelSvg, markupStyle, placeThreadMarks, remarkMarkShape, shapeSvg } from "./markup-svg";
import { withShownPadStates } from "@/lib/markup/pad-state";

const shape = (kind: AnyShape["kind"], geometry: AnyShape["geometry"], properties: Record<string, unknown>): AnyShape =>
  ({ id: `${kind}-1`, kind, geometry, properties, version: 1, createdBy: null, updatedAt: "2025-01-01T00:00:00.000Z" }) as AnyShape;

// 4 µm per output px, y flipped over 1000 px of height: X = x / 4, Y = (4000 − y) / 4 (by hand).
const m = [
  [0.25, 0, 0],
  [0, -0.25, 1000],
] as const;
const style = markupStyle(2000);
const textOf = (svg: string) => [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((x) => x[1]).join(" ");

describe("labels in the annotated PNG", () => {
  it("gives a finished ruler its length, in the decimals the output scale resolves", () => {
    // A 300-400-500 right triangle: the ruler from (100, 100) to (400, 500) µm is 500 µm long;
    // at 4 µm/px whole micrometres are all a pixel resolves.
    const ruler = shape(
      "ruler",
      {
        type: "LineString",
        coordinates: [
          [100, 100],
          [400, 500],
        ],
      },
      { label: "" },
    );
    expect(textOf(labelSvg(ruler, m, style))).toBe("500 µm");
    const named = shape(
      "ruler",
      {
        type: "LineString",
        coordinates: [
          [100, 100],
          [400, 500],
        ],
      },
      { label: "gate pitch" },
    );
    expect(textOf(labelSvg(named, m, style))).toBe("gate pitch: 500 µm");
  });

  it("prints a note's whole text over several lines instead of cutting it", () => {
    const text = Array.from({ length: 30 }, (_, i) => `w${i}`).join(" ") + " VB2 bias network re-worked, see frame 3.";
    const note = shape("note", { type: "Point", coordinates: [2000, 2000] }, { text });
    const svg = labelSvg(note, m, style);
    expect(svg).not.toContain("…");
    expect(textOf(svg)).toBe(text);
    const box = labelBox(note, m, style)!;
    expect(box.lines.length).toBeGreaterThan(1);
    // The plate holds every line: it is as tall as the lines, and it ends above the note's marker.
    expect(box.height).toBeGreaterThanOrEqual(box.lines.length * style.fontPx);
    expect(box.y + box.height).toBeLessThan(500);
  });
});

describe("placeThreadMarks", () => {
  type Rect = { x0: number; y0: number; x1: number; y1: number };
  const overlaps = (a: Rect, b: Rect) => a.x1 > b.x0 && a.x0 < b.x1 && a.y1 > b.y0 && a.y0 < b.y1;

  it("moves a marker anchored on a labelled shape off its label, and markers off each other", () => {
    const pad = shape(
      "pad",
      {
        type: "Polygon",
        coordinates: [
          [
            [1000, 1000],
            [1400, 1000],
            [1400, 1400],
            [1000, 1400],
            [1000, 1000],
          ],
        ],
      },
      { label: "VB2", net: "", state: "bonded" },
    );
    const box = labelBox(pad, m, style)!;
    // Both threads sit on the pad's centre (1200, 1200) µm = output (300, 700), where its label is.
    const threads = [
      { at: [1200, 1200] as [number, number], open: true, number: 1 },
      { at: [1200, 1200] as [number, number], open: false, number: 2 },
    ];
    const placed = placeThreadMarks(threads, [pad], m, style, true);
    // Each marker's outline box, from its tail's tip (the anchor plus the offset).
    const rects = placed.map((t): Rect => {
      const b = remarkMarkShape(t, style).box;
      const [x, y] = [300 + (t.offsetPx?.[0] ?? 0), 700 + (t.offsetPx?.[1] ?? 0)];
      return { x0: x + b.minX, y0: y + b.minY, x1: x + b.maxX, y1: y + b.maxY };
    });
    const label = { x0: box.x, y0: box.y, x1: box.x + box.width, y1: box.y + box.height };
    for (const r of rects) expect(overlaps(r, label)).toBe(false);
    expect(overlaps(rects[0], rects[1])).toBe(false);
    // Without labels drawn, nothing is in the way and the first marker stays on its anchor.
    expect(placeThreadMarks(threads, [pad], m, style, false)[0].offsetPx).toBeUndefined();
  });
});

describe("pad fill in the annotated PNG", () => {
  // Fill opacities of the palette (bonded 0.35, unbonded none); a pad's shown state follows its
  // bonds unless set by hand, so a pad stored as "unbonded" with a bond attached prints filled.
  const pad = shape(
    "pad",
    {
      type: "Polygon",
      coordinates: [
        [
          [0, 0],
          [80, 0],
          [80, 80],
          [0, 80],
          [0, 0],
        ],
      ],
    },
    { label: "VB3", state: "unbonded" },
  );
  const bond = {
    ...shape(
      "wire_bond",
      {
        type: "LineString",
        coordinates: [
          [40, 40],
          [40, -400],
        ],
      },
      { padId: "pad-1" },
    ),
    id: "bond-1",
  } as AnyShape;
  const fillOf = (svg: string) => /<path [^>]*fill="([^"]+)" stroke="#/.exec(svg)?.[1];

  it("fills a pad that carries a bond, even when only the pads are exported", () => {
    const shown = withShownPadStates([pad, bond]).filter((s) => s.kind === "pad");
    expect(fillOf(shapeSvg(shown[0], m, style))).toMatch(/^rgba\(.*,0\.35\)$/);
  });

  it("leaves a pad without a bond hollow, whatever state was stored without a hand choice", () => {
    const stored = { ...pad, properties: { ...pad.properties, state: "bonded" } } as AnyShape;
    expect(fillOf(shapeSvg(withShownPadStates([stored])[0], m, style))).toBe("none");
  });
});
