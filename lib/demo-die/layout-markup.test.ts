import { describe, expect, it } from "vitest";
import { newShapeSchema } from "../validation/markup";
import { checkInsideDie } from "../markup/markup-input";
import { dieBounds } from "../markup/die-bounds";
import { padTableFromMarkup } from "../markup/pad-table-from-markup";
import { symmetryReport } from "../symmetry";
import type { AnyShape } from "../markup/types";
import type { Position } from "../geometry/types";
import { NV24R_LAYOUT } from "./layout";
import { DIE_B_DATE_CODE, withDateCode } from "./date-code";
import { layoutMarkup, type LayoutShape } from "./layout-markup";

// Ground truth throughout: the invented NV-24R layout (lib/demo-die/layout.ts), the very
// description the demo micrographs are rendered from. Expected values are read from it here,
// not from the code under test.
const layout = withDateCode(NV24R_LAYOUT, DIE_B_DATE_CODE);
const shapes = layoutMarkup(layout);
const ofKind = <K extends LayoutShape["kind"]>(kind: K) => shapes.filter((s): s is Extract<LayoutShape, { kind: K }> => s.kind === kind);

/** Centre of an axis-aligned rectangle ring, by hand: the mean of its min and max corners. */
function rectCentre(ring: readonly Position[]): Position {
  const xs = ring.map((p) => p[0]);
  const ys = ring.map((p) => p[1]);
  return [(Math.min(...xs) + Math.max(...xs)) / 2, (Math.min(...ys) + Math.max(...ys)) / 2];
}

const asStored = (s: LayoutShape): AnyShape => ({ ...s, version: 1, createdBy: null, updatedAt: "2026-12-01T00:00:00.000Z" }) as AnyShape;

describe("layoutMarkup (NV-24R layout as ground truth)", () => {
  it("passes the API's own validation and bounds check, shape by shape", () => {
    for (const [i, s] of shapes.entries()) {
      const parsed = newShapeSchema.safeParse(s);
      expect(parsed.success, `${i} ${s.kind}: ${parsed.error?.message}`).toBe(true);
    }
    const bounds = dieBounds({ widthUm: layout.dieSizeUm[0], heightUm: layout.dieSizeUm[1] });
    expect(
      checkInsideDie(
        shapes.map((s) => s.geometry),
        bounds,
        true,
      ),
    ).toBeNull();
    expect(new Set(shapes.map((s) => s.id)).size).toBe(shapes.length);
  });

  it("draws every layout pad once, centred on the layout's pad centre, with its net and state", () => {
    const pads = ofKind("pad");
    expect(pads).toHaveLength(layout.pads.length);
    expect(pads).toHaveLength(22); // the die's notes say 22 bond pads
    for (const pad of layout.pads) {
      const drawn = pads.find((p) => p.properties.label === pad.label)!;
      expect(drawn, pad.label).toBeDefined();
      expect(rectCentre(drawn.geometry.coordinates[0]), pad.label).toEqual(pad.centreUm);
      expect([drawn.properties.net, drawn.properties.state], pad.label).toEqual([pad.net, pad.state]);
    }
  });

  it("puts a wire bond on each bonded pad and on no other, starting at the pad centre", () => {
    const pads = ofKind("pad");
    const bonds = ofKind("wire_bond");
    expect(bonds).toHaveLength(layout.pads.filter((p) => p.state === "bonded").length);
    for (const bond of bonds) {
      const pad = pads.find((p) => p.id === bond.properties.padId)!;
      const truth = layout.pads.find((p) => p.label === pad.properties.label)!;
      expect(truth.state).toBe("bonded");
      expect(bond.geometry.coordinates[0]).toEqual(truth.centreUm);
    }
  });

  it("lays the symmetry axis on the layout's mirror axis across the whole die", () => {
    const [axis] = ofKind("symmetry_axis");
    expect(ofKind("symmetry_axis")).toHaveLength(1);
    expect(axis.geometry.coordinates).toEqual([
      [0, layout.symmetryAxisYUm],
      [layout.dieSizeUm[0], layout.symmetryAxisYUm],
    ]);
  });

  it("outlines the die, names the three stages and measures what the layout gives", () => {
    const [outline] = ofKind("die_outline");
    expect(rectCentre(outline.geometry.coordinates[0])).toEqual([layout.dieSizeUm[0] / 2, layout.dieSizeUm[1] / 2]);
    const names = ofKind("block").map((b) => b.properties.name);
    for (const stage of ["LNA", "Mixer", "IF buffer"]) expect(names).toContain(stage);
    const length = (label: string) => {
      const [[x0, y0], [x1, y1]] = ofKind("ruler").find((r) => r.properties.label === label)!.geometry.coordinates;
      return Math.hypot(x1 - x0, y1 - y0);
    };
    const pad = (label: string) => layout.pads.find((p) => p.label === label)!.centreUm;
    expect(length("Die width")).toBe(layout.dieSizeUm[0]);
    expect(length("GSG pitch")).toBe(Math.abs(pad("G1")[1] - pad("RFIN_P")[1]));
    expect(length("L1 outer diameter")).toBe(layout.spirals[0].outerDiameterUm);
    const meanders = ofKind("trace").filter((t) => t.properties.label?.startsWith("Peaking line"));
    expect(meanders.map((t) => t.geometry.coordinates)).toEqual(layout.meanders.map((m) => m.pointsUm));
    expect(ofKind("note")[0].properties.text).toContain(`date code ${DIE_B_DATE_CODE}`);
  });

  it("gives a pad table (lib/pads) that lists every layout pad at its centre and state", () => {
    const result = padTableFromMarkup(shapes.map(asStored), { widthUm: layout.dieSizeUm[0], heightUm: layout.dieSizeUm[1] });
    if (!result.ok) throw new Error(result.message);
    expect(result.outlineSource).toBe("die_outline");
    expect(result.table.outsideDie).toEqual([]);
    expect(result.table.rows).toHaveLength(layout.pads.length);
    for (const pad of layout.pads) {
      const row = result.table.rows.find((r) => r.label === pad.label)!;
      expect(row, pad.label).toBeDefined();
      expect([row.xUm, row.yUm, row.state, row.net], pad.label).toEqual([...pad.centreUm, pad.state, pad.net]);
    }
    const probed = layout.pads.filter((p) => p.state === "probed").map((p) => p.label);
    expect(result.table.summary.probedNotBonded.map((p) => p.label).sort()).toEqual([...probed].sort());
    expect(result.table.summary.padsPerSide).toEqual({ W: 5, S: 6, E: 5, N: 6 });
  });

  it("is mirror-symmetric about its axis as the layout is: every pad, block and line paired exactly", () => {
    const [axis] = ofKind("symmetry_axis");
    const report = symmetryReport(
      shapes.filter((s) => s.kind !== "symmetry_axis"),
      axis.geometry,
    );
    expect(report.unmatched).toEqual([]);
    // By hand from the layout: 22 pads less G2 and G5 on the axis make 10 pairs; LO buffer P/N and
    // Bias A/B; Peaking line P/N and RF input P/N. On the axis: G2, G5, LNA, Mixer, IF buffer.
    expect([report.summary.pairCount, report.summary.onAxisCount, report.summary.maxDeviationUm]).toEqual([14, 5, 0]);
  });
});

describe("withDateCode", () => {
  it("changes only the date-code text", () => {
    const b = withDateCode(NV24R_LAYOUT, "2451");
    expect(b.textMarks.find((m) => m.kind === "date_code")!.text).toBe("2451");
    expect(NV24R_LAYOUT.textMarks.find((m) => m.kind === "date_code")!.text).toBe("2318");
    expect({ ...b, textMarks: [] }).toEqual({ ...NV24R_LAYOUT, textMarks: [] });
    expect(() => withDateCode(NV24R_LAYOUT, "24-51")).toThrow(RangeError);
  });
});
