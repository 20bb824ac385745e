import { describe, it, expect } from "vitest";
import { parse } from "csv-parse/sync";
import { buildPadTable } from "./build-pad-table";
import { padTableCsv } from "./pad-table-csv";
import { DIE_OUTLINE, pad } from "./test-layout";

// Labels chosen to exercise RFC 4180 §2 rules 5–7: commas, quotes, line breaks.
const pads = [
  pad("p1", 60, 1400, { label: "VB1, bias", net: "vb1" }),
  pad("p2", 60, 1000, { label: 'RF "in" +', net: "rf_in", state: "probed" }),
  pad("p3", 60, 600.5, { label: "two\nlines", net: "vcc" }),
  pad("p4", 400, 60, { label: "crlf\r\ninside", net: "vee", state: "unbonded" }),
  pad("p5", 1200.25, 60, { label: "plain", net: "" }),
];
// OWASP "CSV Injection": text cells that a spreadsheet would read as a formula.
const formulaPads = [pad("f1", 60, 1400, { label: "=CMD()", net: "-5V" }), pad("f2", 60, 1000, { label: "@VB2", net: "+vcc" })];
const table = buildPadTable(pads, DIE_OUTLINE);
const csv = padTableCsv(table);

describe("padTableCsv", () => {
  it("parses back with csv-parse to the same table", () => {
    // csv-parse (an independent RFC 4180 parser), strict about CRLF record ends.
    const records = parse(csv, { columns: true, record_delimiter: "\r\n" }) as Record<string, string>[];
    expect(records).toHaveLength(table.rows.length);
    records.forEach((rec, i) => {
      const row = table.rows[i];
      expect(rec).toEqual({
        number: String(row.number),
        id: row.id,
        label: row.label,
        net: row.net,
        state: row.state,
        side: row.side,
        x_um: String(row.xUm),
        y_um: String(row.yUm),
        x_from_centre_um: String(row.xFromCentreUm),
        y_from_centre_um: String(row.yFromCentreUm),
        width_um: String(row.widthUm),
        height_um: String(row.heightUm),
        pitch_um: row.pitchUm === null ? "" : String(row.pitchUm),
      });
    });
  });

  it("quotes only fields that need it and doubles inner quotes", () => {
    const lines = csv.split("\r\n");
    expect(lines[0]).toBe("number,id,label,net,state,side,x_um,y_um,x_from_centre_um,y_from_centre_um,width_um,height_um,pitch_um");
    expect(lines[1]).toBe('1,p1,"VB1, bias",vb1,bonded,W,60,1400,-1140,600,80,80,400');
    expect(lines[2]).toBe('2,p2,"RF ""in"" +",rf_in,probed,W,60,1000,-1140,200,80,80,399.5');
    expect(csv.endsWith("\r\n")).toBe(true);
  });

  it("rounds µm values to the chosen decimals", () => {
    const oneDecimal = padTableCsv(table, { decimals: 1 });
    const records = parse(oneDecimal, { columns: true }) as Record<string, string>[];
    expect(records[4].x_um).toBe("1200.3"); // ECMA-262 Number.prototype.toFixed: an exact tie (1200.25 is exact in binary) takes the larger n
  });
});

describe("padTableCsv against CSV injection (OWASP CSV Injection cheat sheet)", () => {
  it("prefixes formula-like labels and nets with a single quote; coordinates stay numbers", () => {
    const t = buildPadTable(formulaPads, DIE_OUTLINE);
    const records = parse(padTableCsv(t), { columns: true, record_delimiter: "\r\n" }) as Record<string, string>[];
    expect(records.map((r) => [r.label, r.net])).toEqual([
      ["'=CMD()", "'-5V"],
      ["'@VB2", "'+vcc"],
    ]);
    for (const r of records) expect(Number.isFinite(Number(r.x_from_centre_um))).toBe(true);
    expect(records.some((r) => Number(r.x_from_centre_um) < 0)).toBe(true);
  });
});
