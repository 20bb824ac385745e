import { describe, expect, it } from "vitest";
import { checkSameOrigin } from "./same-origin";

// Origins compared as RFC 6454 §4–5 serialises them (scheme, host and port all count); the
// Sec-Fetch-Site values are those of the W3C Fetch Metadata Request Headers specification.
const OWN = ["http://localhost:3000"];
const req = (method: string, origin: string | null, secFetchSite: string | null = null) => ({ method, origin, secFetchSite });

describe("checkSameOrigin", () => {
  it("lets reads through whatever their origin", () => {
    expect(checkSameOrigin(req("GET", "http://attacker.test"), OWN).ok).toBe(true);
    expect(checkSameOrigin(req("HEAD", "http://attacker.test"), OWN).ok).toBe(true);
  });
  it("refuses a sibling port, another scheme, another host and the opaque origin", () => {
    for (const o of ["http://localhost:3001", "https://localhost:3000", "http://127.0.0.1:3000", "null"]) {
      expect(checkSameOrigin(req("POST", o), OWN).ok, o).toBe(false);
    }
  });
  it("accepts the own origin, case-insensitively", () => {
    expect(checkSameOrigin(req("POST", "http://LOCALHOST:3000"), OWN).ok).toBe(true);
    expect(checkSameOrigin(req("DELETE", "http://localhost:3000", "same-origin"), OWN).ok).toBe(true);
  });
  it("decides by Sec-Fetch-Site when Origin is missing; no header at all is not a browser page", () => {
    expect(checkSameOrigin(req("POST", null, "same-site"), OWN).ok).toBe(false);
    expect(checkSameOrigin(req("POST", null, "cross-site"), OWN).ok).toBe(false);
    expect(checkSameOrigin(req("POST", null, "same-origin"), OWN).ok).toBe(true);
    expect(checkSameOrigin(req("POST", null, "none"), OWN).ok).toBe(true);
    expect(checkSameOrigin(req("POST", null, null), OWN).ok).toBe(true);
  });
});
