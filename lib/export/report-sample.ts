import type { PdfWriter } from "./pdf-layout";
import type { CustodyEventDto, SampleRecordDto } from "@/lib/dto/sample";
import { cautionsForMethods, type Caution } from "@/lib/safety/cautions";
import { CUSTODY_ACTION_LABELS, METHOD_LABELS } from "@/lib/sample/labels";

/** The case's sample record as the report prints it: texts ready, cautions for the methods used. */
export type ReportSample = {
  readonly facts: readonly (readonly [string, string])[];
  readonly steps: readonly (readonly string[])[];
  readonly cautions: readonly Caution[];
  readonly custody: readonly (readonly string[])[];
};

/** Instants as the rest of the report prints them: UTC, to the minute. */
const minute = (iso: string | null) => (iso ? iso.slice(0, 16).replace("T", " ") : "—");

/** The report's view of a sample record and its chain of custody (oldest entry first). */
export function reportSampleOf(record: SampleRecordDto, custody: readonly CustodyEventDto[]): ReportSample {
  return {
    facts: [
      ["Received", minute(record.receivedAt)],
      ["Received from", record.receivedFrom],
      ["Condition", record.condition],
      ["Storage location", record.storageLocation],
    ],
    steps: record.preparation.map((s, i) => [String(i + 1), METHOD_LABELS[s.method], s.chemicals, s.equipment, s.performedBy, minute(s.performedAt), s.notes]),
    cautions: cautionsForMethods(record.preparation.map((s) => s.method)),
    custody: custody.map((e) => [minute(e.at), e.actorName, CUSTODY_ACTION_LABELS[e.action], e.to, e.location, e.note]),
  };
}

/** The report's "Sample record" section: receipt, preparation steps, their cautions, custody log. */
export function sampleSection(w: PdfWriter, s: ReportSample): void {
  w.text("Times are UTC. Cautions name the usual hazards only; the lab's own rules govern the work.", 8.5, { grey: true });
  w.facts(s.facts, 9.5, 110);
  w.text("Preparation", 11, { bold: true });
  if (s.steps.length === 0) w.text("No preparation steps are recorded.", 9);
  else
    w.table(
      [
        { header: "No.", width: 22, align: "right" },
        { header: "Method", width: 78 },
        { header: "Chemicals", width: 72 },
        { header: "Equipment", width: 72 },
        { header: "Performed by", width: 62 },
        { header: "Performed at", width: 82 },
        { header: "Notes", width: 107 },
      ],
      s.steps,
    );
  if (s.cautions.length > 0) {
    w.text("Cautions for the methods used", 11, { bold: true });
    for (const c of s.cautions) {
      w.ensure(40);
      w.text(c.title, 9.5, { bold: true, gap: 1 });
      w.text(c.text, 8.5, { indent: 12, gap: 5 });
    }
  }
  w.text("Chain of custody", 11, { bold: true });
  if (s.custody.length === 0) w.text("No custody entries are recorded.", 9);
  else
    w.table(
      [
        { header: "When", width: 86 },
        { header: "Who", width: 66 },
        { header: "Action", width: 62 },
        { header: "To", width: 75 },
        { header: "Location", width: 90 },
        { header: "Note", width: 116 },
      ],
      s.custody,
    );
}
