import { describe, expect, it } from "vitest";
import { custodyEntrySchema, sampleRecordSchema } from "./sample";

const step = {
  method: "acid_decap",
  chemicals: "fuming nitric acid",
  equipment: "fume hood",
  performedBy: "Demo Analyst",
  performedAt: "2026-11-20",
  notes: "",
};
const record = {
  receivedAt: "2026-11-18T09:15:00+01:00",
  receivedFrom: "Field returns desk",
  condition: "Sealed bag",
  storageLocation: "Dry cabinet 2",
  preparation: [step],
};

describe("sample record schema", () => {
  // Instants checked against ISO 8601 / RFC 3339 §5.6 offsets worked by hand: 09:15 at +01:00 is 08:15 UTC;
  // a date-only form is read as midnight UTC (ECMA-262, Date Time String Format).
  it("accepts ISO 8601 dates and date-times and answers the UTC instant", () => {
    const out = sampleRecordSchema.parse(record);
    expect(out.receivedAt).toBe("2026-11-18T08:15:00.000Z");
    expect(out.preparation[0].performedAt).toBe("2026-11-20T00:00:00.000Z");
  });

  it("takes the empty record", () => {
    expect(sampleRecordSchema.parse({ receivedAt: null, receivedFrom: "", condition: "", storageLocation: "", preparation: [] }).preparation).toEqual([]);
  });

  it("refuses dates that are not ISO 8601, naming the field", () => {
    for (const bad of ["18/11/2026", "2026-11-18T09:15", "2026-13-01", "yesterday"]) {
      const r = sampleRecordSchema.safeParse({ ...record, receivedAt: bad });
      expect(r.success).toBe(false);
      expect(r.error?.issues[0].path).toEqual(["receivedAt"]);
    }
  });

  it("refuses an unknown method and unknown fields (strict objects)", () => {
    const r = sampleRecordSchema.safeParse({ ...record, preparation: [{ ...step, method: "boiling" }] });
    expect(r.error?.issues[0].path).toEqual(["preparation", 0, "method"]);
    expect(sampleRecordSchema.safeParse({ ...record, updatedBy: "x" }).success).toBe(false);
    expect(sampleRecordSchema.safeParse({ ...record, preparation: [{ ...step, temperature: 80 }] }).success).toBe(false);
  });

  it("refuses more than 50 steps and over-long text", () => {
    expect(sampleRecordSchema.safeParse({ ...record, preparation: Array(51).fill(step) }).success).toBe(false);
    expect(sampleRecordSchema.safeParse({ ...record, storageLocation: "x".repeat(201) }).error?.issues[0].path).toEqual(["storageLocation"]);
  });
});

describe("custody entry schema", () => {
  it("takes an action and a note, to and location optional", () => {
    expect(custodyEntrySchema.parse({ action: "stored", note: "" })).toEqual({ action: "stored", to: "", location: "", note: "" });
  });

  it("refuses who and when from the body", () => {
    expect(custodyEntrySchema.safeParse({ action: "stored", note: "", at: "2020-01-01T00:00:00Z" }).success).toBe(false);
    expect(custodyEntrySchema.safeParse({ action: "stored", note: "", actorId: "00000000-0000-4000-8000-000000000000" }).success).toBe(false);
    expect(custodyEntrySchema.safeParse({ action: "lost", note: "" }).error?.issues[0].path).toEqual(["action"]);
  });
});
