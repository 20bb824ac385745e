import { describe, it, expect } from "vitest";
import { attachmentDisposition, safeFileName } from "./attachment";

describe("attachmentDisposition", () => {
  it("encodes the UTF-8 name as RFC 8187 does", () => {
    // RFC 8187 §3.2.3 example: "€ rates" is UTF-8''%e2%82%ac%20rates (hex digits are case-insensitive, §3.2.1).
    const header = attachmentDisposition("€ rates");
    expect(header.toLowerCase()).toContain("filename*=utf-8''%e2%82%ac%20rates");
    // RFC 6266 §4.1: filename is a quoted-string; ours holds no quote or backslash to escape.
    expect(header).toMatch(/^attachment; filename="[A-Za-z0-9._-]+"; /);
  });

  it("keeps a die's name readable in the ASCII fallback", () => {
    expect(safeFileName("NV-24R die A pad table.csv")).toBe("NV-24R-die-A-pad-table.csv");
    expect(safeFileName('Prüfling µ/3 "x".csv')).toBe("Prufling-3-x.csv");
    expect(safeFileName("///")).toBe("die");
  });
});
