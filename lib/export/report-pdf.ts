import { A4, PdfWriter, type Column } from "./pdf-layout";
import type { PadTable } from "@/lib/pads";
import { formatUm } from "@/lib/units/format-um";
import { sampleSection, type ReportSample } from "./report-sample";

/** Everything the die report shows, gathered by the data-access layer. */
export type ReportData = {
  readonly generatedAt: string;
  readonly generatedBy: string;
  readonly caseInfo: { readonly title: string; readonly partMarking: string; readonly package: string; readonly sampleId: string };
  readonly die: {
    readonly name: string;
    readonly widthUm: number | null;
    readonly heightUm: number | null;
    readonly analyst: string;
    readonly reviewStatus: string;
    readonly revision: string;
    readonly notes: string;
  };
  readonly overview: { readonly png: Uint8Array; readonly caption: string } | null;
  readonly padTable: PadTable | { readonly unavailable: string };
  readonly blocks: readonly { readonly name: string; readonly function: string; readonly areaUm2: number }[];
  readonly measurements: readonly { readonly kind: string; readonly label: string; readonly lengthUm: number; readonly widthUm?: number }[];
  readonly reviewHistory: readonly {
    readonly at: string;
    readonly who: string;
    readonly action: string;
    readonly from: string;
    readonly to: string;
    readonly message: string;
  }[];
  readonly threads: readonly ReportThread[];
  /** The case's sample record, preparation cautions and chain of custody. */
  readonly sample: ReportSample;
  /** Estimates saved on shapes, each with every input and result it holds. */
  readonly estimates: readonly ReportEstimate[];
  /** Scale of the micrograph that defines the die frame: how many decimals lengths get. */
  readonly umPerPx: number | null;
  readonly micrographs: readonly {
    readonly label: string;
    readonly illumination: string;
    readonly size: string;
    readonly scale: string;
    readonly objective: string;
    readonly reference: boolean;
    readonly alignmentRms: string;
    readonly status: string;
  }[];
};

/** One review thread with every message in order (the first is the remark, the rest replies). */
type ReportThread = {
  readonly number: number;
  readonly status: string;
  readonly author: string;
  readonly createdAt: string;
  readonly on: string;
  readonly resolved: string | null;
  readonly messages: readonly { readonly author: string; readonly at: string; readonly body: string; readonly edited: boolean }[];
};

/** One estimate saved on a shape. */
type ReportEstimate = {
  readonly shape: string;
  readonly formula: string;
  readonly summary: string;
  readonly source: string;
  readonly savedAt: string;
  readonly warnings: string;
  readonly values: readonly (readonly [string, string])[];
};

/**
 * `keep`: points that must fit below the heading, or the section starts on the next page.
 * `ownPage`: the section starts on a fresh page (the sample record, which a lab may file apart).
 */
type Section = { title: string; keep?: number; ownPage?: boolean; draw: (w: PdfWriter) => Promise<void> | void };

const OVERVIEW_MIN_HEIGHT = 240;

function sections(d: ReportData): Section[] {
  const um = (v: number | null | undefined) => (v === null || v === undefined ? "—" : formatUm(v, d.umPerPx));
  return [
    {
      title: "Overview",
      keep: d.overview ? OVERVIEW_MIN_HEIGHT + 60 : undefined,
      draw: async (w) => {
        if (!d.overview) return w.text("No micrograph of this die is in the die frame yet, so no overview image could be drawn.");
        await w.image(d.overview.png, 420, d.overview.caption, OVERVIEW_MIN_HEIGHT);
      },
    },
    { title: "Pad table", draw: (w) => padSection(w, d.padTable, um) },
    {
      title: "Blocks and their functions",
      draw: (w) =>
        d.blocks.length === 0
          ? w.text("No blocks are marked.", 9)
          : w.table(
              [
                { header: "Block", width: 150 },
                { header: "Function", width: 245 },
                { header: "Area (µm²)", width: 100, align: "right" },
              ],
              d.blocks.map((b) => [b.name || "(unnamed)", b.function, b.areaUm2.toFixed(0)]),
            ),
    },
    {
      title: "Measurements",
      draw: (w) =>
        d.measurements.length === 0
          ? w.text("No rulers or traces are drawn.", 9)
          : w.table(
              [
                { header: "Kind", width: 80 },
                { header: "Label", width: 215 },
                { header: "Length (µm)", width: 100, align: "right" },
                { header: "Width (µm)", width: 100, align: "right" },
              ],
              d.measurements.map((m) => [m.kind, m.label, um(m.lengthUm), m.widthUm === undefined ? "" : um(m.widthUm)]),
            ),
    },
    { title: "Saved estimates", draw: (w) => estimatesSection(w, d.estimates) },
    { title: "Check and remarks", draw: (w) => reviewSection(w, d) },
    {
      title: "Micrographs",
      draw: (w) =>
        w.table(
          [
            { header: "Micrograph", width: 110 },
            { header: "Illumination", width: 70 },
            { header: "Pixels", width: 70 },
            { header: "Scale", width: 70 },
            { header: "Objective", width: 60 },
            { header: "Alignment RMS", width: 70 },
            { header: "Status", width: 45 },
          ],
          d.micrographs.map((m) => [`${m.label}${m.reference ? " (reference)" : ""}`, m.illumination, m.size, m.scale, m.objective, m.alignmentRms, m.status]),
        ),
    },
    { title: "Sample record", ownPage: true, draw: (w) => sampleSection(w, d.sample) },
  ];
}

function padSection(w: PdfWriter, t: ReportData["padTable"], um: (v: number | null | undefined) => string) {
  if ("unavailable" in t) return w.text(t.unavailable, 9);
  const s = t.summary.padsPerSide;
  w.text(
    `${t.rows.length} pads (N ${s.N}, E ${s.E}, S ${s.S}, W ${s.W}); smallest pitch ${t.summary.minPitchUm === null ? "—" : `${um(t.summary.minPitchUm)} µm`}. Numbered counter-clockwise from pad 1; positions from the die's lower-left corner.`,
    9,
  );
  const cols: Column[] = [
    { header: "No.", width: 30, align: "right" },
    { header: "Label", width: 90 },
    { header: "Net", width: 80 },
    { header: "State", width: 55 },
    { header: "Side", width: 30 },
    { header: "x (µm)", width: 55, align: "right" },
    { header: "y (µm)", width: 55, align: "right" },
    { header: "Size (µm)", width: 55, align: "right" },
    { header: "Pitch", width: 45, align: "right" },
  ];
  w.table(
    cols,
    t.rows.map((r) => [String(r.number), r.label, r.net, r.state, r.side, um(r.xUm), um(r.yUm), `${um(r.widthUm)}×${um(r.heightUm)}`, um(r.pitchUm)]),
  );
}

function estimatesSection(w: PdfWriter, estimates: ReportData["estimates"]) {
  if (estimates.length === 0) return w.text("No estimates are saved on shapes.", 9);
  w.text("First-order estimates from the drawn geometry, as saved on each shape: every input and result, the formula and its source.", 9, { grey: true });
  for (const e of estimates) {
    w.text(`${e.shape}: ${e.formula}${e.summary ? ` — ${e.summary}` : ""}`, 9.5, { bold: true, gap: 2 });
    w.text(e.values.map(([k, v]) => `${k} ${v}`).join(" · "), 8.5, { indent: 12, gap: 2 });
    if (e.warnings) w.text(`Warnings: ${e.warnings}`, 8.5, { indent: 12, gap: 2 });
    w.text(`Source: ${e.source}. Saved ${e.savedAt}.`, 8, { indent: 12, grey: true, gap: 6 });
  }
}

function reviewSection(w: PdfWriter, d: ReportData) {
  w.facts(
    [
      ["Check status", d.die.reviewStatus],
      ["Revision", d.die.revision],
      ["Analyst", d.die.analyst],
    ],
    9.5,
    110,
  );
  w.text("History", 11, { bold: true });
  if (d.reviewHistory.length === 0) w.text("The die has not been sent to the checker yet.", 9);
  for (const h of d.reviewHistory) {
    w.text(`${h.at} · ${h.who} · ${h.action} (${h.from} to ${h.to})`, 9, { bold: true, gap: 1 });
    if (h.message) w.text(h.message, 9, { indent: 12, gap: 5 });
    else w.y -= 4;
  }
  w.y -= 4;
  w.text("Remarks", 11, { bold: true });
  if (d.threads.length === 0) w.text("No remarks.", 9);
  for (const t of d.threads) {
    w.ensure(40);
    const resolved = t.resolved ? `; ${t.resolved}` : "";
    w.text(`Remark ${t.number} · ${t.status} · raised by ${t.author} on ${t.createdAt} · ${t.on}${resolved}`, 9.5, { bold: true, gap: 2 });
    for (const m of t.messages) {
      w.ensure(26); // the author line stays with the message's first line
      w.text(`${m.author}, ${m.at}${m.edited ? " (edited)" : ""}`, 8, { indent: 12, grey: true, gap: 0 });
      w.text(m.body, 9, { indent: 12, gap: 4 });
    }
    w.y -= 4;
  }
}

function cover(w: PdfWriter, d: ReportData) {
  const um = (v: number) => formatUm(v, d.umPerPx);
  w.text("Die report", 24, { bold: true, gap: 6 });
  w.text(`${d.caseInfo.title} — ${d.die.name}`, 14, { gap: 12 });
  w.facts(
    [
      ["Case", d.caseInfo.title],
      ["Part marking", d.caseInfo.partMarking],
      ["Package", d.caseInfo.package],
      ["Sample", d.caseInfo.sampleId],
      ["Die", d.die.name],
      ["Die size", d.die.widthUm && d.die.heightUm ? `${um(d.die.widthUm)} × ${um(d.die.heightUm)} µm` : "not recorded"],
      ["Analyst", d.die.analyst],
      ["Check status", d.die.reviewStatus],
      ["Revision", d.die.revision],
      ["Notes", d.die.notes],
      ["Generated", `${d.generatedAt} by ${d.generatedBy}`],
    ],
    9.5,
    110,
  );
  w.text("Coordinates are in the die frame: micrometres from the die's lower-left corner, x right, y up.", 8.5, { grey: true });
}

const CONTENTS_LINE = 13;

/**
 * The die report as a PDF: a cover with the contents, then the sections one after another,
 * text flowing across pages (a heading never sits alone at the foot of a page), and "page n of
 * N" on every page. The contents lines are reserved on the cover and filled once every
 * section's page is known.
 */
export async function buildReportPdf(d: ReportData): Promise<Uint8Array> {
  const w = await PdfWriter.create(`Die report: ${d.caseInfo.title} — ${d.die.name}`);
  cover(w, d);
  const list = sections(d);
  w.text("Contents", 11, { bold: true, gap: 2 });
  const toc = w.reserve(list.length * CONTENTS_LINE + 8);
  const starts: { title: string; page: number }[] = [];
  for (const s of list) {
    if (s.ownPage) w.newPage();
    w.heading(s.title, 14, s.keep);
    starts.push({ title: s.title, page: w.pageIndex + 1 });
    await s.draw(w);
  }
  const last = { page: w.page, y: w.y };
  w.page = toc.page;
  starts.forEach((s, i) => {
    const y = toc.y - CONTENTS_LINE * (i + 1);
    const num = String(s.page);
    w.page.drawText(s.title, { x: 50, y, size: 9.5, font: w.font });
    w.page.drawText(num, { x: A4[0] - 50 - w.font.widthOfTextAtSize(num, 9.5), y, size: 9.5, font: w.font });
  });
  w.page = last.page;
  w.y = last.y;
  w.numberPages(`${d.caseInfo.title} — ${d.die.name}`);
  return w.doc.save();
}
