import { PdfWriter, type Column } from "./pdf-layout";
import type { PadTable } from "@/lib/pads";
import { formatUm } from "@/lib/units/format-um";

/** Everything the die report shows, gathered by the data-access layer. */
export type ReportData = {
  readonly generatedAt: string;
  readonly generatedBy: string;
  readonly caseInfo: { readonly title: string; readonly partMarking: string; readonly package: string; readonly sampleId: string };
  readonly die: { readonly name: string; readonly widthUm: number | null; readonly heightUm: number | null; readonly analyst: string; readonly reviewStatus: string; readonly notes: string };
  readonly overview: { readonly png: Uint8Array; readonly caption: string } | null;
  readonly padTable: PadTable | { readonly unavailable: string };
  readonly blocks: readonly { readonly name: string; readonly function: string; readonly areaUm2: number }[];
  readonly measurements: readonly { readonly kind: string; readonly label: string; readonly lengthUm: number; readonly widthUm?: number }[];
  readonly reviewHistory: readonly { readonly at: string; readonly who: string; readonly action: string; readonly from: string; readonly to: string; readonly message: string }[];
  readonly threads: readonly { readonly number: number; readonly status: string; readonly author: string; readonly firstComment: string; readonly comments: number; readonly createdAt: string }[];
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

/** µm through the one formatter, at `digits` decimals (0.1 µm: what an optical micrograph resolves at best). */
const um = (v: number | null | undefined, digits = 1) => (v === null || v === undefined ? "—" : formatUm(v, 10 ** -digits));

type Section = { title: string; draw: (w: PdfWriter) => Promise<void> | void };

function sections(d: ReportData): Section[] {
  return [
    {
      title: "Overview",
      draw: async (w) => {
        if (!d.overview) return w.text("No micrograph of this die is in the die frame yet, so no overview image could be drawn.");
        await w.image(d.overview.png);
        w.text(d.overview.caption, 9);
      },
    },
    { title: "Pad table", draw: (w) => padSection(w, d.padTable) },
    {
      title: "Blocks and their functions",
      draw: (w) =>
        d.blocks.length === 0
          ? w.text("No blocks are marked.")
          : w.table([{ header: "Block", width: 150 }, { header: "Function", width: 245 }, { header: "Area (µm²)", width: 100, align: "right" }], d.blocks.map((b) => [b.name || "(unnamed)", b.function, b.areaUm2.toFixed(0)])),
    },
    {
      title: "Measurements",
      draw: (w) =>
        d.measurements.length === 0
          ? w.text("No rulers or traces are drawn.")
          : w.table(
              [{ header: "Kind", width: 80 }, { header: "Label", width: 215 }, { header: "Length (µm)", width: 100, align: "right" }, { header: "Width (µm)", width: 100, align: "right" }],
              d.measurements.map((m) => [m.kind, m.label, m.lengthUm.toFixed(1), m.widthUm === undefined ? "" : m.widthUm.toFixed(2)]),
            ),
    },
    { title: "Review", draw: (w) => reviewSection(w, d) },
    {
      title: "Micrographs",
      draw: (w) =>
        w.table(
          [{ header: "Micrograph", width: 110 }, { header: "Illumination", width: 70 }, { header: "Pixels", width: 75 }, { header: "Scale", width: 70 }, { header: "Objective", width: 60 }, { header: "Alignment RMS", width: 75 }, { header: "Status", width: 35 }],
          d.micrographs.map((m) => [`${m.label}${m.reference ? " (reference)" : ""}`, m.illumination, m.size, m.scale, m.objective, m.alignmentRms, m.status]),
        ),
    },
  ];
}

function padSection(w: PdfWriter, t: ReportData["padTable"]) {
  if ("unavailable" in t) return w.text(t.unavailable);
  const s = t.summary.padsPerSide;
  w.text(`${t.rows.length} pads (N ${s.N}, E ${s.E}, S ${s.S}, W ${s.W}); smallest pitch ${t.summary.minPitchUm === null ? "—" : `${um(t.summary.minPitchUm)} µm`}. Numbered counter-clockwise from pad 1; positions from the die's lower-left corner.`, 9);
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
  w.table(cols, t.rows.map((r) => [String(r.number), r.label, r.net, r.state, r.side, um(r.xUm), um(r.yUm), `${um(r.widthUm, 0)}×${um(r.heightUm, 0)}`, um(r.pitchUm)]));
}

function reviewSection(w: PdfWriter, d: ReportData) {
  w.facts([["Review status", d.die.reviewStatus], ["Analyst", d.die.analyst]]);
  w.text("History", 11, { bold: true });
  if (d.reviewHistory.length === 0) w.text("The die has not been submitted for review yet.", 9);
  else w.table([{ header: "When", width: 95 }, { header: "Who", width: 90 }, { header: "Action", width: 80 }, { header: "Status", width: 110 }, { header: "Message", width: 120 }], d.reviewHistory.map((h) => [h.at, h.who, h.action, `${h.from} to ${h.to}`, h.message]));
  w.text("Threads", 11, { bold: true });
  if (d.threads.length === 0) w.text("No review threads.", 9);
  else w.table([{ header: "No.", width: 30, align: "right" }, { header: "Status", width: 55 }, { header: "Opened by", width: 85 }, { header: "First comment", width: 230 }, { header: "Comments", width: 55, align: "right" }, { header: "Opened", width: 40 }], d.threads.map((t) => [String(t.number), t.status, t.author, t.firstComment, String(t.comments), t.createdAt]));
}

function cover(w: PdfWriter, d: ReportData) {
  w.y -= 80;
  w.text("Die report", 28, { bold: true, gap: 14 });
  w.text(`${d.caseInfo.title} — ${d.die.name}`, 16, { gap: 24 });
  w.facts([
    ["Case", d.caseInfo.title],
    ["Part marking", d.caseInfo.partMarking],
    ["Package", d.caseInfo.package],
    ["Sample", d.caseInfo.sampleId],
    ["Die", d.die.name],
    ["Die size", d.die.widthUm && d.die.heightUm ? `${um(d.die.widthUm)} × ${um(d.die.heightUm)} µm` : "not recorded"],
    ["Analyst", d.die.analyst],
    ["Review status", d.die.reviewStatus],
    ["Notes", d.die.notes],
    ["Generated", `${d.generatedAt} by ${d.generatedBy}`],
  ]);
  w.text("Coordinates are in the die frame: micrometres from the die's lower-left corner, x right, y up.", 9);
}

/**
 * The die report as a PDF: cover, table of contents, then one section per topic, each starting
 * on a new page, and "page n of N" on every page. The contents page is reserved first and
 * filled once every section's first page is known.
 */
export async function buildReportPdf(d: ReportData): Promise<Uint8Array> {
  const w = await PdfWriter.create(`Die report: ${d.caseInfo.title} — ${d.die.name}`);
  cover(w, d);
  w.newPage();
  const tocPage = w.page;
  const starts: { title: string; page: number }[] = [];
  for (const s of sections(d)) {
    w.newPage();
    starts.push({ title: s.title, page: w.pageIndex + 1 });
    w.heading(s.title);
    await s.draw(w);
  }
  const last = w.page;
  w.page = tocPage;
  w.y = 841.89 - 50;
  w.heading("Contents", 18);
  w.table([{ header: "Section", width: 400 }, { header: "Page", width: 95, align: "right" }], starts.map((s) => [s.title, String(s.page)]), 11);
  w.page = last;
  w.numberPages(`${d.caseInfo.title} — ${d.die.name}`);
  return w.doc.save();
}
