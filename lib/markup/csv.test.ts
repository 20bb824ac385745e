import { describe, expect, it } from "vitest";
import { parse } from "csv-parse/sync";
import { csvField, csvRecords } from "./csv";

// OWASP Cheat Sheet "CSV Injection": cells beginning with = + - @ tab (0x09) or carriage return
// (0x0D) are prefixed with a single quote, wrapped in double quotes, inner quotes doubled.
describe("csvField neutralises formula-like text (OWASP CSV Injection)", () => {
  const dangerous = ['=HYPERLINK("http://x.test","pad")', "+1+2", "-2+3", "@SUM(A1:A3)", "\tVB1", "\rVB1"];
  it("prefixes a single quote and quotes the cell", () => {
    for (const text of dangerous) {
      const cell = csvField(text);
      expect(cell.startsWith("\"'"), JSON.stringify(text)).toBe(true);
      // csv-parse, an independent RFC 4180 parser, reads back the text behind the quote.
      const [[back]] = parse(`${cell}\r\n`, { record_delimiter: "\r\n", relax_quotes: false }) as string[][];
      expect(back).toBe(`'${text}`);
    }
  });
  it("leaves other text and numbers alone: a negative number stays a number", () => {
    expect(csvField("VB1")).toBe("VB1");
    expect(csvField("a, b")).toBe('"a, b"');
    expect(csvField("pad =1")).toBe("pad =1");
    expect(csvRecords([[-12.5, -3, null, "-3"]], 3)).toBe('-12.5,-3,,"\'-3"\r\n');
  });
});

describe("csvRecords (csv-stringify, RFC 4180)", () => {
  it("quotes commas, quotes and line breaks, rounds numbers and ends every record with CRLF", () => {
    const csv = csvRecords(
      [
        ["label", "x_um"],
        ['a "b", c', 1.23456],
        ["two\nlines", -0],
        ["cr\rlf", null],
      ],
      3,
    );
    expect(csv).toBe('label,x_um\r\n"a ""b"", c",1.235\r\n"two\nlines",0\r\n"cr\rlf",\r\n');
    // csv-parse, an independent RFC 4180 parser, reads back every cell.
    expect(parse(csv, { record_delimiter: "\r\n" })).toEqual([
      ["label", "x_um"],
      ['a "b", c', "1.235"],
      ["two\nlines", "0"],
      ["cr\rlf", ""],
    ]);
  });
});
