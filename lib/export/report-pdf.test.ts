import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import sharp from "sharp";
import { buildReportPdf, type ReportData } from "./report-pdf";
import { wrapText } from "./wrap-text";
import { reportSampleOf } from "./report-sample";
import { CAUTIONS } from "@/lib/safety/cautions";

// The report read back by poppler's pdftotext (an independent PDF reader): every review message,
// reply and saved estimate is there in full, and the layout flows instead of one page a section.
const LONG =
  Array.from({ length: 60 }, (_, i) => `word${i}`).join(" ") +
  " the bias network of VB2 looks re-worked near the mixer; please confirm against the second dark-field frame.";
const MESSAGES = [
  "Is the bandgap trimmed? Ω ± 5 %",
  LONG,
  "Reply: yes, two fuses are blown on the trim ladder, see frame 3 at 50x.",
  "Second reply with a long explanation: " + LONG,
  "Pad pitch checked",
];

function data(): ReportData {
  return {
    generatedAt: "2026-12-02 14:30",
    generatedBy: "Ola Owner",
    caseInfo: { title: "NV-24R receiver teardown", partMarking: "NV24R-A", package: "QFN-24", sampleId: "S-0042" },
    die: {
      name: "die 1",
      widthUm: 2399.9999812,
      heightUm: 1600.0000004,
      analyst: "Ana Analyst",
      reviewStatus: "With checker",
      revision: "Revision 1 · with checker, not signed off",
      notes: "Opened with fuming nitric acid by the lab (see the lab's safety rules).",
    },
    overview: null,
    padTable: { unavailable: "No pads are drawn." },
    blocks: [{ name: "LNA", function: "low-noise amplifier, first stage", areaUm2: 120000 }],
    measurements: [{ kind: "Ruler", label: "die width", lengthUm: 2399.9999812 }],
    reviewHistory: [
      { at: "2026-12-01 09:12", who: "Ana Analyst", action: "submit", from: "draft", to: "with checker", message: "Ready for a look: " + LONG },
      {
        at: "2026-12-01 15:40",
        who: "Rita Reviewer",
        action: "request changes",
        from: "with checker",
        to: "returned",
        message: "Pads 7 and 8 swapped, please recheck the supply pins before sign-off.",
      },
    ],
    threads: [
      {
        number: 1,
        status: "open",
        author: "Rita Reviewer",
        createdAt: "2026-12-01 15:31",
        on: "on block LNA",
        resolved: null,
        messages: [
          { author: "Rita Reviewer", at: "2026-12-01 15:31", body: MESSAGES[0], edited: false },
          { author: "Ana Analyst", at: "2026-12-01 16:02", body: MESSAGES[2], edited: true },
        ],
      },
      {
        number: 2,
        status: "closed",
        author: "Rita Reviewer",
        createdAt: "2026-12-01 15:33",
        on: "on a drawn region",
        resolved: "closed by Rita Reviewer on 2026-12-02 08:00",
        messages: [
          { author: "Rita Reviewer", at: "2026-12-01 15:33", body: MESSAGES[1], edited: false },
          { author: "Ana Analyst", at: "2026-12-01 16:10", body: MESSAGES[3], edited: false },
          { author: "Rita Reviewer", at: "2026-12-02 08:00", body: MESSAGES[4], edited: false },
        ],
      },
    ],
    estimates: [
      {
        shape: "Wire bond RFIN",
        formula: "Bond-wire inductance (Rosa; Grover)",
        summary: "L 1.02 nH",
        source: "Grover, Inductance Calculations",
        savedAt: "2026-12-01 14:00",
        warnings: "",
        values: [
          ["length (µm)", "1000"],
          ["diameter (µm)", "25"],
          ["inductance (nH)", "1.024"],
        ],
      },
      {
        shape: "Trace TL1",
        formula: "Microstrip impedance (Hammerstad & Jensen)",
        summary: "Z0 49.8 Ω (microstrip)",
        source: "Hammerstad and Jensen 1980",
        savedAt: "2026-12-01 14:05",
        warnings: "w/h outside the fitted range",
        values: [
          ["width (µm)", "10"],
          ["z0 (Ω)", "49.81"],
        ],
      },
    ],
    sample: reportSampleOf(
      {
        receivedAt: "2026-11-16T09:20:00.000Z",
        receivedFrom: "Nordvik Semiconductor field returns desk",
        condition: "Sealed antistatic bag",
        storageLocation: "Dry cabinet DC-2",
        preparation: [
          {
            method: "acid_decap",
            chemicals: "Fuming nitric acid",
            equipment: "Fume hood FH-1",
            performedBy: "Ana Analyst",
            performedAt: "2026-11-18T10:00:00.000Z",
            notes: "",
          },
          { method: "delayer_wet", chemicals: "", equipment: "", performedBy: "Ana Analyst", performedAt: null, notes: "Top metal only" },
        ],
      },
      [
        {
          id: "e1",
          action: "received",
          to: "Fjordlight Failure Lab",
          location: "Goods-in",
          note: "Seal intact",
          actorId: null,
          actorName: "Ana Analyst",
          at: "2026-11-16T09:20:00.000Z",
        },
        {
          id: "e2",
          action: "checked_out",
          to: "Wet lab",
          location: "Fume hood FH-1",
          note: "",
          actorId: null,
          actorName: "Ana Analyst",
          at: "2026-11-18T08:30:00.000Z",
        },
      ],
    ),
    umPerPx: 0.45,
    micrographs: [
      {
        label: "bright field 5x",
        illumination: "bright field",
        size: "5334 × 3556",
        scale: "0.450 µm/px",
        objective: "5×, NA 0.15",
        reference: true,
        alignmentRms: "reference",
        status: "ready",
      },
    ],
  };
}

function pdfText(pdf: Uint8Array): { text: string; pages: number; info: string } {
  const dir = mkdtempSync(join(tmpdir(), "report-pdf-"));
  try {
    const file = join(dir, "r.pdf");
    writeFileSync(file, pdf);
    const text = execFileSync("pdftotext", ["-layout", "-enc", "UTF-8", file, "-"], { encoding: "utf8" });
    const info = execFileSync("pdfinfo", [file], { encoding: "utf8" });
    return { text, pages: Number(/Pages:\s+(\d+)/.exec(info)![1]), info };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
// Words of the text in order, whatever the line breaks and column spacing pdftotext chose.
const words = (s: string) => s.replace(/\f/g, " ").split(/\s+/).filter(Boolean).join(" ");

describe("buildReportPdf", () => {
  it("prints every review message and reply in full, without ellipses", async () => {
    const { text } = pdfText(await buildReportPdf(data()));
    const flat = words(text);
    for (const m of [...MESSAGES, "Pads 7 and 8 swapped, please recheck the supply pins before sign-off.", "Ready for a look: " + LONG])
      expect(flat).toContain(words(m));
    expect(text).not.toContain("…");
    for (const date of ["2026-12-01 15:31", "2026-12-01 16:02", "2026-12-02 08:00", "2026-12-01 09:12"]) expect(flat).toContain(date);
    expect(flat).toContain("closed by Rita Reviewer");
  });

  it("names Kerfline alone as its creator and producer, as poppler's pdfinfo reads them", async () => {
    const { info } = pdfText(await buildReportPdf(data()));
    expect(/^Creator:\s+(.*)$/m.exec(info)?.[1]).toBe("Kerfline");
    expect(/^Producer:\s+(.*)$/m.exec(info)?.[1]).toBe("Kerfline");
  });

  it("prints every saved estimate with its inputs, results, formula and source", async () => {
    const flat = words(pdfText(await buildReportPdf(data())).text);
    expect(flat).toContain("Bond-wire inductance (Rosa; Grover) — L 1.02 nH");
    expect(flat).toContain("length (µm) 1000 · diameter (µm) 25 · inductance (nH) 1.024");
    expect(flat).toContain("Microstrip impedance (Hammerstad & Jensen) — Z0 49.8 Ω (microstrip)");
    expect(flat).toContain("Warnings: w/h outside the fitted range");
    expect(flat).toContain("Source: Hammerstad and Jensen 1980");
  });

  it("prints the sample record: steps, each caution once for the methods used, and the custody log", async () => {
    const flat = words(pdfText(await buildReportPdf(data())).text);
    expect(flat).toContain("Sample record");
    expect(flat).toContain("Nordvik Semiconductor field returns desk");
    expect(flat).toContain("Acid decapsulation");
    expect(flat).toContain("Wet delayering");
    // Both methods map to the acid caution (issue #15 §3): it is printed once, in full.
    expect(flat).toContain(words(CAUTIONS.acid.text));
    expect(flat.split(CAUTIONS.acid.title).length - 1).toBe(1);
    expect(flat).not.toContain(CAUTIONS.laser.title);
    expect(flat).toContain("2026-11-16 09:20 Ana Analyst Received");
    expect(flat).toContain("Ana Analyst 2026-11-18 10:00");
    expect(flat).toContain("Times are UTC.");
    expect(flat).toContain("Checked out");
  });

  it("flows the sections onto few pages and lists them with their pages on the cover", async () => {
    const { text, pages } = pdfText(await buildReportPdf(data()));
    // This much text fills about two A4 pages, and the sample record has a page of its own;
    // one page per section gave eight.
    expect(pages).toBeLessThanOrEqual(4);
    expect(text).toContain(`page ${pages} of ${pages}`);
    const cover = text.split("\f")[0];
    expect(cover).toMatch(/Contents[\s\S]*Check and remarks\s+\d[\s\S]*Micrographs\s+\d[\s\S]*Sample record\s+\d/);
    // Lengths carry the decimals the 0.45 µm/px scale supports (one), not float noise.
    expect(words(text)).toContain("2400.0 × 1600.0 µm");
  });

  it("keeps a page-wide overview with the text that follows it", async () => {
    const png = await sharp({ create: { width: 1600, height: 1067, channels: 3, background: { r: 90, g: 100, b: 80 } } })
      .png()
      .toBuffer();
    const { pages } = pdfText(await buildReportPdf({ ...data(), overview: { png, caption: "bright field 5x, whole die" } }));
    expect(pages).toBeLessThanOrEqual(5);
  });
});

describe("wrapText", () => {
  // Ground truth by hand with a monospace measure: one unit per character.
  const mono = (s: string) => s.length;
  it("wraps at word boundaries, keeps line breaks and breaks words longer than a line", () => {
    expect(wrapText("aa bb cc", 5, mono)).toEqual(["aa bb", "cc"]);
    expect(wrapText("one\ntwo three", 9, mono)).toEqual(["one", "two three"]);
    expect(wrapText("abcdefghij k", 4, mono)).toEqual(["abcd", "efgh", "ij k"]);
    expect(wrapText("", 4, mono)).toEqual([""]);
  });
});
