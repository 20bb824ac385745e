import "server-only";
import { asc, eq, inArray } from "drizzle-orm";
import { comments, micrographs, reviewEvents, threads, users, type MicrographRow } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { loadDie } from "./dies";
import { loadDieSources, type DieSources } from "./export-sources";
import { NotFoundError } from "@/lib/errors";
import { polygonArea, polylineLength } from "@/lib/geometry/measure";
import { padTableFromMarkup } from "@/lib/markup/pad-table-from-markup";
import { shapeLabel } from "@/lib/markup/markup-table";
import { KIND_STYLE } from "@/lib/markup/palette";
import type { ReportData } from "@/lib/export/report-pdf";
import { ILLUMINATION_LABELS } from "@/lib/validation/micrographs";
import { savedEstimatesOf, summariseSavedEstimate } from "@/lib/layout-reading/saved-estimates";
import type { AnyShape } from "@/lib/markup/types";
import { reportSampleOf } from "@/lib/export/report-sample";
import { sampleOfDie } from "./sample";
import { REVIEW_ACTION_DONE, REVIEW_STATUS_LABELS } from "@/lib/review/review-status";
import { revisionStatement } from "@/lib/review/revision-text";

const day = (d: Date) => d.toISOString().slice(0, 16).replace("T", " ");

async function namesOf(db: Db, ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((i): i is string => !!i))];
  if (wanted.length === 0) return new Map();
  const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, wanted));
  return new Map(rows.map((r) => [r.id, r.name]));
}

function shapeName(shapes: readonly AnyShape[], id: string | null): string {
  const shape = id ? shapes.find((x) => x.id === id) : undefined;
  if (!shape) return id ? "on a shape since deleted" : "on a drawn region";
  const label = shapeLabel(shape);
  return `on ${KIND_STYLE[shape.kind].label.toLowerCase()}${label ? ` ${label}` : ""}`;
}

async function reviewParts(db: Db, dieId: string, shapes: readonly AnyShape[]): Promise<Pick<ReportData, "reviewHistory" | "threads">> {
  const events = await db.select().from(reviewEvents).where(eq(reviewEvents.dieId, dieId)).orderBy(asc(reviewEvents.at));
  const ts = await db.select().from(threads).where(eq(threads.dieId, dieId)).orderBy(asc(threads.createdAt));
  const cs = ts.length
    ? await db
        .select()
        .from(comments)
        .where(
          inArray(
            comments.threadId,
            ts.map((t) => t.id),
          ),
        )
        .orderBy(asc(comments.createdAt))
    : [];
  const names = await namesOf(db, [
    ...events.map((e) => e.actorId),
    ...ts.map((t) => t.createdBy),
    ...ts.map((t) => t.resolvedBy),
    ...cs.map((c) => c.authorId),
  ]);
  const who = (id: string | null) => names.get(id ?? "") ?? "—";
  return {
    reviewHistory: events.map((e) => ({
      at: day(e.at),
      who: who(e.actorId),
      action: `${REVIEW_ACTION_DONE[e.action]}${e.overrideOpenRemarks ? " over open remarks" : ""}, revision ${e.revision}`,
      from: REVIEW_STATUS_LABELS[e.fromStatus].toLowerCase(),
      to: REVIEW_STATUS_LABELS[e.toStatus].toLowerCase(),
      message: e.message,
    })),
    threads: ts.map((t, i) => ({
      number: i + 1,
      // The stored `resolved` is a closed remark in the report's words.
      status: t.status === "resolved" ? "closed" : "open",
      author: who(t.createdBy),
      createdAt: day(t.createdAt),
      on: shapeName(shapes, t.shapeId),
      resolved: t.status === "resolved" ? `closed by ${who(t.resolvedBy)}${t.resolvedAt ? ` on ${day(t.resolvedAt)}` : ""}` : null,
      messages: cs
        .filter((c) => c.threadId === t.id)
        .map((c) => ({ author: who(c.authorId), at: day(c.createdAt), body: c.body, edited: c.editedAt !== null })),
    })),
  };
}

const UNIT_SUFFIX: Record<string, string> = { Um: "µm", Nh: "nH", Ph: "pH", Ohm: "Ω", Mm: "mm", Ghz: "GHz", Mhz: "MHz", Deg: "°", Um2: "µm²" };

/** "innerDiameterUm" → "inner diameter (µm)": the saved field's name for people. */
function estimateFieldName(key: string): string {
  const m = /^(.*?)(Um2|Um|Nh|Ph|Ohm|Mm|Ghz|Mhz|Deg)$/.exec(key);
  const base = (m ? m[1] : key).replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase();
  return m ? `${base} (${UNIT_SUFFIX[m[2]]})` : base;
}

const estimateValue = (v: number | string | boolean | null) => (typeof v === "number" ? String(Number(v.toPrecision(4))) : v === null ? "—" : String(v));
const RECORD_META = new Set(["kind", "formula", "source", "savedAt", "warnings"]);

function estimatesOf(shapes: readonly AnyShape[]): ReportData["estimates"] {
  return shapes.flatMap((shape) =>
    Object.values(savedEstimatesOf(shape.properties)).map((e) => ({
      shape: `${KIND_STYLE[shape.kind].label}${shapeLabel(shape) ? ` ${shapeLabel(shape)}` : ""}`,
      formula: String(e.formula ?? e.kind ?? "estimate"),
      summary: summariseSavedEstimate(e) ?? "",
      source: String(e.source ?? "—"),
      savedAt: typeof e.savedAt === "string" ? e.savedAt.slice(0, 16).replace("T", " ") : "—",
      warnings: typeof e.warnings === "string" ? e.warnings : "",
      values: Object.entries(e)
        .filter(([k]) => !RECORD_META.has(k))
        .map(([k, v]) => [estimateFieldName(k), estimateValue(v)] as const),
    })),
  );
}

async function reportSample(db: Db, dieId: string): Promise<ReportData["sample"]> {
  const { record, custody } = await sampleOfDie(db, dieId);
  return reportSampleOf(record, custody);
}

/** Renders the report's whole-die picture from the die's records (the caller owns the pixels). */
export type OverviewRenderer = (src: DieSources, micrographs: MicrographRow[], author: string) => Promise<ReportData["overview"]>;

/**
 * Gathers the die report (any member may export): case and die data, the overview the caller
 * renders, pad table, blocks, measurements, review history and threads, micrographs.
 */
export async function loadReport(db: Db, actor: Actor, dieId: string, renderOverview: OverviewRenderer): Promise<ReportData> {
  await loadDie(db, actor, dieId, "export");
  const src = await loadDieSources(db, dieId);
  if (!src) throw new NotFoundError("That die");
  const ms = await db.select().from(micrographs).where(eq(micrographs.dieId, dieId)).orderBy(asc(micrographs.position));
  const me = (await namesOf(db, [actor.userId])).get(actor.userId) ?? "unknown";
  const pads = padTableFromMarkup(src.shapes, src.die);
  const lines = src.shapes.filter((s) => s.kind === "ruler" || s.kind === "trace");
  return {
    generatedAt: day(new Date()),
    generatedBy: me,
    caseInfo: src.caseRow,
    die: {
      name: src.die.name,
      widthUm: src.die.widthUm,
      heightUm: src.die.heightUm,
      analyst: src.die.analystName ?? "—",
      reviewStatus: REVIEW_STATUS_LABELS[src.die.reviewStatus],
      revision: revisionStatement(src.die.revision),
      notes: src.die.notes,
    },
    overview: await renderOverview(src, ms, me),
    padTable: pads.ok ? pads.table : { unavailable: pads.message },
    blocks: src.shapes.flatMap((s) =>
      s.kind === "block" ? [{ name: s.properties.name, function: s.properties.function, areaUm2: polygonArea(s.geometry) }] : [],
    ),
    measurements: lines.map((s) => ({
      kind: KIND_STYLE[s.kind].label,
      label: shapeLabel(s),
      lengthUm: polylineLength((s.geometry as { coordinates: readonly (readonly [number, number])[] }).coordinates),
      ...(s.kind === "trace" ? { widthUm: s.properties.widthUm } : {}),
    })),
    ...(await reviewParts(db, dieId, src.shapes)),
    estimates: estimatesOf(src.shapes),
    sample: await reportSample(db, dieId),
    umPerPx: ms.find((m) => m.isReference)?.scaleUmPerPx ?? null,
    micrographs: ms.map((m) => ({
      label: m.label,
      illumination: ILLUMINATION_LABELS[m.illumination],
      size: m.width && m.height ? `${m.width} × ${m.height}` : "—",
      scale: m.scaleUmPerPx ? `${m.scaleUmPerPx.toPrecision(3)} µm/px` : "not set",
      objective: [m.objectiveMag ? `${m.objectiveMag}×` : "", m.numericalAperture ? `NA ${m.numericalAperture}` : ""].filter(Boolean).join(", ") || "—",
      reference: m.isReference,
      alignmentRms: m.isReference ? "reference" : m.alignmentRmsUm === null ? "not aligned" : `${m.alignmentRmsUm.toFixed(2)} µm`,
      status: m.status,
    })),
  };
}
