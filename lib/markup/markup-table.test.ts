import { describe, it, expect } from "vitest";
import { parse } from "csv-parse/sync";
import { markupTableCsv, markupTableRows, MARKUP_TABLE_HEADERS } from "./markup-table";
import type { AnyShape } from "./types";

const T = "2026-03-02T10:00:00.000Z";
const ANALYST = "0b6a3c7e-0000-4000-8000-00000000000a";
const authors = { [ANALYST]: "Demo Analyst" };

const shape = (s: Omit<AnyShape, "version" | "updatedAt" | "createdBy"> & { createdBy?: string | null }): AnyShape =>
  ({ version: 1, updatedAt: T, createdBy: ANALYST, ...s }) as AnyShape;

const pad = shape({
  id: "pad-1",
  kind: "pad",
  geometry: {
    type: "Polygon",
    coordinates: [
      [
        [100, 200],
        [180, 200],
        [180, 260],
        [100, 260],
        [100, 200],
      ],
    ],
  },
  properties: { label: 'VB1, "bias"', net: "vb1", state: "bonded" },
});
// An L: a 40×10 bar along the bottom and a 10×20 post on its left end.
const block = shape({
  id: "block-1",
  kind: "block",
  geometry: {
    type: "Polygon",
    coordinates: [
      [
        [0, 0],
        [40, 0],
        [40, 10],
        [10, 10],
        [10, 30],
        [0, 30],
        [0, 0],
      ],
    ],
  },
  properties: { name: "LNA", function: "low-noise amplifier" },
});
// A 100×100 square with a 20×20 hole centred on (70, 70).
const outline = shape({
  id: "outline-1",
  kind: "die_outline",
  geometry: {
    type: "Polygon",
    coordinates: [
      [
        [0, 0],
        [100, 0],
        [100, 100],
        [0, 100],
        [0, 0],
      ],
      [
        [60, 60],
        [60, 80],
        [80, 80],
        [80, 60],
        [60, 60],
      ],
    ],
  },
  properties: {},
});
const ruler = shape({
  id: "ruler-1",
  kind: "ruler",
  geometry: {
    type: "LineString",
    coordinates: [
      [0, 0],
      [3, 4],
      [3, 10],
    ],
  },
  properties: { label: "gap" },
});
const note = shape({ id: "note-1", kind: "note", geometry: { type: "Point", coordinates: [12.5, -3] }, properties: { text: "scratch\nnear pad 3" } });
const trace = shape({
  id: "trace-1",
  kind: "trace",
  createdBy: null,
  geometry: {
    type: "LineString",
    coordinates: [
      [0, 0],
      [0, 2],
    ],
  },
  properties: { widthUm: 4 },
});

const rows = markupTableRows([pad, block, outline, ruler, note, trace], authors);

describe("markupTableRows", () => {
  it("gives a rectangle's area, size and centre", () => {
    // Hand-worked: 80 µm × 60 µm rectangle from (100, 200): area 4800 µm², centre (140, 230).
    expect(rows[0]).toMatchObject({
      label: 'VB1, "bias"',
      lengthUm: null,
      areaUm2: 4800,
      widthUm: 80,
      heightUm: 60,
      xUm: 140,
      yUm: 230,
      author: "Demo Analyst",
    });
  });

  it("finds the centre of area of an L by composite areas", () => {
    // Method of composite areas (e.g. Beer & Johnston, Vector Mechanics for Engineers: Statics,
    // ch. 5): bar 400 µm² at (20, 5) + post 200 µm² at (5, 20) → area 600, centre (15, 10). Hand-worked.
    expect(rows[1]).toMatchObject({ label: "LNA", areaUm2: 600, widthUm: 40, heightUm: 30 });
    expect(rows[1].xUm).toBeCloseTo(15, 12);
    expect(rows[1].yUm).toBeCloseTo(10, 12);
  });

  it("subtracts a hole from area and moment", () => {
    // Composite areas with a negative part: 10000 − 400 = 9600 µm²;
    // x̄ = ȳ = (10000·50 − 400·70) / 9600 = 49.1666… µm. Hand-worked.
    expect(rows[2].areaUm2).toBe(9600);
    expect(rows[2].xUm).toBeCloseTo(472000 / 9600, 10);
    expect(rows[2].yUm).toBeCloseTo(472000 / 9600, 10);
    expect(rows[2].label).toBe("");
  });

  it("measures a polyline's length and centre of length", () => {
    // 3-4-5 right triangle (Pythagoras) then a 6 µm leg: length 11 µm; the centre weights each
    // segment's midpoint by its length: ((5·1.5 + 6·3) / 11, (5·2 + 6·7) / 11). Hand-worked.
    expect(rows[3]).toMatchObject({ label: "gap", areaUm2: null, widthUm: 3, heightUm: 10 });
    expect(rows[3].lengthUm).toBeCloseTo(11, 12);
    expect(rows[3].xUm).toBeCloseTo(25.5 / 11, 12);
    expect(rows[3].yUm).toBeCloseTo(52 / 11, 12);
  });

  it("takes a note's text as its label and its point as its centre", () => {
    expect(rows[4]).toEqual({
      id: "note-1",
      kind: "note",
      label: "scratch\nnear pad 3",
      lengthUm: null,
      areaUm2: null,
      widthUm: 0,
      heightUm: 0,
      xUm: 12.5,
      yUm: -3,
      author: "Demo Analyst",
      updatedAt: T,
      estimates: "",
    });
  });

  it("leaves the author empty when the account is gone", () => {
    expect(rows[5]).toMatchObject({ author: "", lengthUm: 2, label: "" });
  });
});

describe("markupTableCsv", () => {
  const csv = markupTableCsv(rows);

  it("parses back with csv-parse to the same rows", () => {
    // csv-parse, an independent RFC 4180 parser, strict about CRLF record ends.
    const records = parse(csv, { columns: true, record_delimiter: "\r\n" }) as Record<string, string>[];
    expect(Object.keys(records[0])).toEqual(MARKUP_TABLE_HEADERS);
    expect(records.map((r) => r.label)).toEqual(rows.map((r) => r.label));
    expect(records[0]).toMatchObject({
      id: "pad-1",
      kind: "pad",
      length_um: "",
      area_um2: "4800",
      x_um: "140",
      y_um: "230",
      author: "Demo Analyst",
      updated_at: T,
    });
    records.forEach((rec, i) => {
      const row = rows[i];
      for (const [key, value] of [
        ["x_um", row.xUm],
        ["y_um", row.yUm],
        ["width_um", row.widthUm],
        ["height_um", row.heightUm],
      ] as const) {
        expect(Math.abs(Number(rec[key]) - value)).toBeLessThanOrEqual(0.0005);
      }
    });
  });

  it("quotes labels holding commas, quotes or line breaks and rounds to 3 decimals", () => {
    const lines = csv.split("\r\n");
    expect(lines[0]).toBe("id,kind,label,length_um,area_um2,width_um,height_um,x_um,y_um,author,updated_at,estimates");
    expect(lines[1]).toBe(`pad-1,pad,"VB1, ""bias""",,4800,80,60,140,230,Demo Analyst,${T},`);
    // 472000 / 9600 = 49.1666…, 3 decimals → 49.167 (ECMA-262 Number.prototype.toFixed).
    expect(lines[3]).toBe(`outline-1,die_outline,,,9600,100,100,49.167,49.167,Demo Analyst,${T},`);
    expect(csv.endsWith("\r\n")).toBe(true);
  });
});
