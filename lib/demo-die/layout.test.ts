import { describe, expect, it } from "vitest";
import type { Position } from "../geometry/types";
import { NV24R_LAYOUT as L, padByLabel } from "./layout";
import type { DieSide } from "./layout-types";
import { ringHalfSize } from "./spiral-path";

// The reference for these checks is the demo scenario of PRODUCT.md (die about 2.40 × 1.60 mm,
// differential, mirror-symmetric about a horizontal axis, about 22 pads, GSG RF pads at input
// and output, VCC, VEE, VB1..VB3, some probed but unbonded, a spiral, two meander lines) and
// the plain definition of a mirror image across y = 800: (x, y) ↦ (x, 1600 − y).
const mirror = ([x, y]: Position): Position => [x, 1600 - y];
const same = (a: Position, b: Position) => a[0] === b[0] && a[1] === b[1];
const MIRROR_SIDE: Record<DieSide, DieSide> = { left: "left", right: "right", top: "bottom", bottom: "top" };

describe("NV-24R layout", () => {
  it("matches the demo scenario's die", () => {
    expect(L.dieSizeUm).toEqual([2400, 1600]);
    expect(L.symmetryAxisYUm).toBe(800);
    expect(L.maker).toBe("Nordvik Semiconductor");
    expect(L.pads).toHaveLength(22);
    expect(new Set(L.pads.map((p) => p.label)).size).toBe(22);
    for (const net of ["VCC", "VEE", "VB1", "VB2", "VB3", "RFIN_P", "RFIN_N", "IFOUT_P", "IFOUT_N", "GND"]) {
      expect(
        L.pads.some((p) => p.net === net),
        net,
      ).toBe(true);
    }
    expect(L.pads.some((p) => p.state === "probed")).toBe(true);
    expect(L.pads.some((p) => p.state === "unbonded")).toBe(true);
    expect(L.spirals).toHaveLength(1);
    expect(L.meanders).toHaveLength(2);
    expect(L.blocks.map((b) => b.name)).toEqual(expect.arrayContaining(["LNA", "Mixer", "IF buffer"]));
  });

  it("has ground–signal–ground RF pads at the input (left) and output (right) edges", () => {
    for (const [side, signal] of [
      ["left", "RFIN"],
      ["right", "IFOUT"],
    ] as const) {
      const column = L.pads.filter((p) => p.side === side).sort((a, b) => b.centreUm[1] - a.centreUm[1]);
      expect(column.map((p) => (p.net === "GND" ? "G" : p.net.startsWith(signal) ? "S" : "?")).join("")).toBe("GSGSG");
    }
  });

  it("pairs every pad with a mirror partner across y = 800 (brute force)", () => {
    for (const pad of L.pads) {
      const partners = L.pads.filter((q) => same(q.centreUm, mirror(pad.centreUm)) && same(q.sizeUm, pad.sizeUm) && q.side === MIRROR_SIDE[pad.side]);
      expect(partners, pad.label).toHaveLength(1);
    }
  });

  it("mirrors blocks, meanders, routes and capacitors across y = 800 (brute force)", () => {
    const ringKey = (ring: readonly Position[]) => [...new Set(ring.map((p) => p.join(",")))].sort().join(" ");
    for (const b of L.blocks) {
      expect(
        L.blocks.filter((q) => ringKey(q.polygonUm) === ringKey(b.polygonUm.map(mirror))),
        b.name,
      ).toHaveLength(1);
    }
    const lineKey = (pts: readonly Position[]) => pts.map((p) => p.join(",")).join(" ");
    for (const t of [...L.meanders, ...L.routes]) {
      const partners = [...L.meanders, ...L.routes].filter((q) => q.widthUm === t.widthUm && lineKey(q.pointsUm) === lineKey(t.pointsUm.map(mirror)));
      expect(partners, t.name).toHaveLength(1);
    }
    for (const c of L.capacitors) {
      expect(
        L.capacitors.filter((q) => same(q.centreUm, mirror(c.centreUm)) && same(q.sizeUm, c.sizeUm)),
        c.name,
      ).toHaveLength(1);
    }
    // Bonds follow pad states, which are not mirrored (VB1S and VB2S are only probed, NC1 is
    // left open): a bond has a mirrored partner exactly when the partner pad is bonded too.
    for (const w of L.wireBonds) {
      const partnerPad = L.pads.find((p) => same(p.centreUm, mirror(w.fromUm)));
      const partners = L.wireBonds.filter((q) => same(q.fromUm, mirror(w.fromUm)) && same(q.toUm, mirror(w.toUm)));
      expect(partners, w.pad).toHaveLength(partnerPad?.state === "bonded" ? 1 : 0);
    }
    for (const s of L.spirals) expect(s.centreUm[1]).toBe(800);
  });

  it("keeps pads inside the die and apart from each other", () => {
    for (const p of L.pads) {
      const [x, y] = p.centreUm;
      const [w, h] = p.sizeUm;
      expect(x - w / 2 > 0 && x + w / 2 < 2400 && y - h / 2 > 0 && y + h / 2 < 1600, p.label).toBe(true);
    }
    for (const a of L.pads) {
      for (const b of L.pads) {
        if (a === b) continue;
        const gapX = Math.abs(a.centreUm[0] - b.centreUm[0]) - (a.sizeUm[0] + b.sizeUm[0]) / 2;
        const gapY = Math.abs(a.centreUm[1] - b.centreUm[1]) - (a.sizeUm[1] + b.sizeUm[1]) / 2;
        expect(Math.max(gapX, gapY), `${a.label}–${b.label}`).toBeGreaterThanOrEqual(50);
      }
    }
  });

  it("bonds exactly the bonded pads, from the pad centre to beyond the die edge", () => {
    const bonded = L.pads.filter((p) => p.state === "bonded").map((p) => p.label);
    expect(L.wireBonds.map((w) => w.pad).sort()).toEqual([...bonded].sort());
    for (const w of L.wireBonds) {
      expect(w.fromUm).toEqual(padByLabel(L, w.pad).centreUm);
      const [x, y] = w.toUm;
      expect(x < 0 || x > 2400 || y < 0 || y > 1600, w.pad).toBe(true);
      expect(w.diameterUm).toBe(25);
    }
  });

  it("gives the spiral a positive inner diameter", () => {
    // d_in = d_out − 2·n·w − 2·(n − 1)·s for n turns (Mohan et al., IEEE JSSC 34(10), 1999,
    // define d_in and d_out as the inner and outer edge-to-edge sizes): 200 − 72 − 24 = 104 µm.
    const s = L.spirals[0];
    const inner = 2 * (ringHalfSize(s, s.turns - 1) - s.widthUm / 2);
    expect(inner).toBeCloseTo(200 - 2 * 3 * 12 - 2 * 2 * 6, 9);
  });
});
