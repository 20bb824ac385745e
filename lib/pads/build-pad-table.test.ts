import { describe, it, expect } from "vitest";
import { buildPadTable } from "./build-pad-table";
import { PadTableInputError } from "./pad-table-input-error";
import { DIE_OUTLINE, pad, rect, rotatePolygon } from "./test-layout";
import type { PadInput } from "./types";

// The layout below and every expected number are worked by hand on the invented 2400 µm ×
// 1600 µm demo die. Counter-clockwise seen from above with y up: down the left edge, right
// along the bottom, up the right edge, left along the top.
const left = [pad("w1", 60, 1400), pad("w2", 60, 1000), pad("w3", 60, 600), pad("w4", 60, 200)];
const bottom = [pad("s1", 400, 60), pad("s2", 1200, 60), pad("s3", 2000, 60, { state: "probed" })];
const right = [pad("e1", 2340, 300), pad("e2", 2340, 800), pad("e3", 2340, 1300, { state: "unbonded" })];
const top = [pad("n1", 2000, 1540), pad("n2", 1200, 1540, { state: "probed" }), pad("n3", 400, 1540)];
const allPads = [...top, ...right, ...left, ...bottom]; // deliberately out of order
const ccwIds = ["w1", "w2", "w3", "w4", "s1", "s2", "s3", "e1", "e2", "e3", "n1", "n2", "n3"];

const ids = (pads: readonly PadInput[], options = {}, outline = DIE_OUTLINE) => buildPadTable(pads, outline, options).rows.map((r) => r.id);

describe("buildPadTable numbering", () => {
  it("numbers pads counter-clockwise from the topmost pad on the left edge", () => {
    const table = buildPadTable(allPads, DIE_OUTLINE);
    expect(table.rows.map((r) => r.id)).toEqual(ccwIds);
    expect(table.rows.map((r) => r.number)).toEqual(ccwIds.map((_, i) => i + 1));
  });

  it("starts from the analyst's chosen pad 1 and keeps going round", () => {
    expect(ids(allPads, { padOneId: "s2" })).toEqual([...ccwIds.slice(5), ...ccwIds.slice(0, 5)]);
  });

  it("starts from a pad flagged as pad 1 when no id is given", () => {
    const flagged = allPads.map((p) => (p.id === "e3" ? pad("e3", 2340, 1300, { isPadOne: true }) : p));
    expect(ids(flagged)[0]).toBe("e3");
    expect(ids(flagged, { padOneId: "n1" })[0]).toBe("n1"); // the option wins over the flag
  });

  it("starts on the bottom edge when the left edge has no pads", () => {
    expect(ids([...top, ...right, ...bottom])).toEqual(ccwIds.slice(4));
  });

  it("places pads exactly on the corners on the side leaving each corner counter-clockwise", () => {
    const corners = [pad("ll", 0, 0), pad("lr", 2400, 0), pad("ur", 2400, 1600), pad("ul", 0, 1600)];
    const table = buildPadTable([...corners, ...allPads], DIE_OUTLINE);
    const sideOf = (id: string) => table.rows.find((r) => r.id === id)?.side;
    expect([sideOf("ll"), sideOf("lr"), sideOf("ur"), sideOf("ul")]).toEqual(["S", "E", "N", "W"]);
    expect(table.rows.map((r) => r.id)).toEqual(["ul", "w1", "w2", "w3", "w4", "ll", "s1", "s2", "s3", "lr", "e1", "e2", "e3", "ur", "n1", "n2", "n3"]);
  });

  it("numbers a rotated die the same in the die outline's own axes", () => {
    // The whole die turned 30° about (500, −200) and shifted: by hand nothing about the
    // table may change except the reported rotation.
    const turn = (g: PadInput["geometry"]) => rotatePolygon(g, 30, [500, -200], [1000, 250]);
    const rotated = allPads.map((p) => ({ ...p, geometry: turn(p.geometry) }));
    const plain = buildPadTable(allPads, DIE_OUTLINE);
    const table = buildPadTable(rotated, turn(DIE_OUTLINE));
    expect(table.die.rotationDeg).toBeCloseTo(30, 9);
    expect(table.die.widthUm).toBeCloseTo(2400, 9);
    expect(table.die.heightUm).toBeCloseTo(1600, 9);
    expect(table.rows.map((r) => [r.id, r.side])).toEqual(plain.rows.map((r) => [r.id, r.side]));
    table.rows.forEach((r, i) => {
      for (const key of ["xUm", "yUm", "xFromCentreUm", "yFromCentreUm", "widthUm", "heightUm"] as const) {
        expect(r[key]).toBeCloseTo(plain.rows[i][key], 9);
      }
      if (plain.rows[i].pitchUm === null) expect(r.pitchUm).toBeNull();
      else expect(r.pitchUm).toBeCloseTo(plain.rows[i].pitchUm as number, 9);
    });
  });

  it("reads a slightly clockwise-turned die with its bottom edge still at the bottom", () => {
    const turn = (g: PadInput["geometry"]) => rotatePolygon(g, -20, [1200, 800], [0, 0]);
    const table = buildPadTable(
      allPads.map((p) => ({ ...p, geometry: turn(p.geometry) })),
      turn(DIE_OUTLINE),
    );
    expect(table.die.rotationDeg).toBeCloseTo(-20, 9);
    expect(table.rows.map((r) => r.id)).toEqual(ccwIds);
  });
});

describe("buildPadTable geometry", () => {
  const table = buildPadTable(allPads, DIE_OUTLINE);
  const row = (id: string) => table.rows.find((r) => r.id === id)!;

  it("assigns each pad to its nearest die edge", () => {
    expect(table.rows.map((r) => r.side)).toEqual(["W", "W", "W", "W", "S", "S", "S", "E", "E", "E", "N", "N", "N"]);
    // (150, 100): 150 µm from the left edge, 100 µm from the bottom, so S.
    expect(buildPadTable([pad("x", 150, 100)], DIE_OUTLINE).rows[0].side).toBe("S");
  });

  it("gives centres from the lower-left corner and from the die centre", () => {
    expect(row("w1")).toMatchObject({ xUm: 60, yUm: 1400, xFromCentreUm: -1140, yFromCentreUm: 600 });
    expect(row("e1")).toMatchObject({ xUm: 2340, yUm: 300, xFromCentreUm: 1140, yFromCentreUm: -500 });
  });

  it("gives width along die x and height along die y", () => {
    const tall = buildPadTable([pad("t", 60, 800, {}, 80, 120)], DIE_OUTLINE).rows[0];
    expect([tall.widthUm, tall.heightUm]).toEqual([80, 120]);
  });

  it("gives the pitch to the next pad on the same side, null for the last", () => {
    expect(table.rows.map((r) => r.pitchUm)).toEqual([400, 400, 400, null, 800, 800, null, 500, 500, null, 800, 800, null]);
  });

  it("keeps pitches geometric when pad 1 is in the middle of a side", () => {
    const fromW3 = buildPadTable(allPads, DIE_OUTLINE, { padOneId: "w3" }).rows;
    expect(fromW3.map((r) => [r.id, r.pitchUm]).slice(-2)).toEqual([
      ["w1", 400],
      ["w2", 400],
    ]);
    expect(fromW3[1]).toMatchObject({ id: "w4", pitchUm: null });
  });

  it("summarises pads per side, the minimum pitch and probed-but-unbonded pads", () => {
    expect(table.summary.padsPerSide).toEqual({ N: 3, E: 3, S: 3, W: 4 });
    expect(table.summary.minPitchUm).toBe(400);
    expect(table.summary.probedNotBonded).toEqual([
      { number: 7, id: "s3", label: "S3" },
      { number: 12, id: "n2", label: "N2" },
    ]);
  });

  it("gives an empty table for no pads", () => {
    const empty = buildPadTable([], DIE_OUTLINE);
    expect(empty.rows).toEqual([]);
    expect(empty.summary.minPitchUm).toBeNull();
  });
});

describe("buildPadTable input checks", () => {
  it("rejects an unknown pad 1, two flagged pads and duplicate ids", () => {
    expect(() => buildPadTable(allPads, DIE_OUTLINE, { padOneId: "zz" })).toThrow(PadTableInputError);
    const twoFlags = [pad("a", 60, 800, { isPadOne: true }), pad("b", 60, 400, { isPadOne: true })];
    expect(() => buildPadTable(twoFlags, DIE_OUTLINE)).toThrow(/more than one pad/);
    expect(() => buildPadTable([pad("a", 60, 800), pad("a", 60, 400)], DIE_OUTLINE)).toThrow(/unique/);
  });

  it("rejects a die outline that is not a rectangle", () => {
    const kite = {
      type: "Polygon" as const,
      coordinates: [
        [
          [0, 0],
          [10, 0],
          [12, 12],
          [0, 10],
          [0, 0],
        ] as [number, number][],
      ],
    };
    expect(() => buildPadTable(allPads, kite)).toThrow(/right angles/);
    const triangle = {
      type: "Polygon" as const,
      coordinates: [
        [
          [0, 0],
          [10, 0],
          [0, 10],
          [0, 0],
        ] as [number, number][],
      ],
    };
    expect(() => buildPadTable(allPads, triangle)).toThrow(/rectangle/);
  });

  it("rejects pads with non-finite coordinates", () => {
    const bad = { ...pad("a", 60, 800), geometry: rect(Number.NaN, 800, 80, 80) };
    expect(() => buildPadTable([bad], DIE_OUTLINE)).toThrow(/finite/);
  });
});
