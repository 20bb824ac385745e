import { describe, expect, it } from "vitest";
import { CAUTIONS, DEFER_TO_LAB, HAZARDS, PROBING_CAUTION, cautionFor, cautionsForMethods } from "./cautions";
import { METHOD_LABELS } from "@/lib/sample/labels";
import { PREPARATION_METHODS } from "@/lib/dto/stored-values";

describe("sample preparation cautions", () => {
  it("gives every preparation method a caution and a plain label", () => {
    for (const m of PREPARATION_METHODS) {
      expect(cautionFor(m).text.length).toBeGreaterThan(80);
      expect(METHOD_LABELS[m]).toMatch(/^[A-Z][a-z -]+$/);
    }
  });

  // The method → hazard mapping asked for in issue #15 §3 (the requirement, outside this module).
  it("maps methods to the hazards issue #15 names", () => {
    const expected = {
      acid_decap: "acid",
      delayer_wet: "acid",
      laser_decap: "laser",
      plasma_etch: "plasma",
      delayer_rie: "plasma",
      mechanical_polish: "iii_v_dust",
      cross_section: "iii_v_dust",
      delid: "general",
      other: "general",
    } as const;
    for (const m of PREPARATION_METHODS) expect(cautionFor(m).hazard).toBe(expected[m]);
    expect(cautionFor("mechanical_polish").text).toMatch(/applies to III-V dies/);
    expect(cautionFor("acid_decap").text).toMatch(/fume hood/);
    expect(cautionFor("acid_decap").text).toMatch(/face shield/);
    expect(cautionFor("laser_decap").text).toMatch(/interlocks/);
    expect(cautionFor("laser_decap").text).toMatch(/eye protection/);
    expect(cautionFor("laser_decap").text).toMatch(/fume extraction/);
    expect(cautionFor("plasma_etch").text).toMatch(/toxic, corrosive/);
    expect(PROBING_CAUTION.text).toMatch(/shock/);
    expect(PROBING_CAUTION.text).toMatch(/electrostatic discharge/);
  });

  it("ends every caution by deferring to the lab's rules, chemical hygiene plan and local regulations", () => {
    for (const h of HAZARDS) {
      expect(CAUTIONS[h].text.endsWith(DEFER_TO_LAB)).toBe(true);
    }
    expect(DEFER_TO_LAB).toMatch(/lab's own safety rules/);
    expect(DEFER_TO_LAB).toMatch(/chemical hygiene plan/);
    expect(DEFER_TO_LAB).toMatch(/local regulations/);
  });

  // A consistency check of our own wording (no outside source): a caution names hazards and
  // protection, never a procedure — so no durations, temperatures, concentrations, settings or numbered steps.
  it("contains no procedural quantities or numbered steps", () => {
    const procedural = [
      /\d+\s*(s|sec|seconds?|min|minutes?|h|hours?)\b/i,
      /\d+\s*(°|deg|degrees?|℃|K\b)/i,
      /\d+\s*(%|ml|mL|l\b|g\b|mg|W\b|mW|kV|V\b|mA|A\b|nm|Pa|Torr|sccm)/,
      /(^|\s)(step\s*\d|\d+[.)]\s)/i,
      /\b(first|then|next|afterwards|finally)\b,?\s+(heat|add|pour|rinse|etch|dip|immerse|set)/i,
    ];
    for (const h of HAZARDS) for (const p of procedural) expect(CAUTIONS[h].text, `${h} matches ${p}`).not.toMatch(p);
  });

  it("lists each hazard once for the methods a record used, in order of first use", () => {
    expect(cautionsForMethods(["acid_decap", "delayer_wet", "mechanical_polish", "acid_decap"]).map((c) => c.hazard)).toEqual(["acid", "iii_v_dust"]);
    expect(cautionsForMethods([])).toEqual([]);
  });
});
