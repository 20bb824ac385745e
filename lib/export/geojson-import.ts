import { randomUUID } from "node:crypto";
import type { z } from "zod";
import { newShapeSchema, type NewShapeInput } from "@/lib/validation/markup";
import { describeBounds, firstPositionOutside, type DieBounds } from "@/lib/markup/die-bounds";
import { MARKUP_KINDS, type MarkupKind } from "@/lib/markup/types";
import type { InputFailure, InputIssue, Parsed } from "@/lib/markup/markup-input";

/** Most features one import may hold (five POST batches' worth). */
export const MAX_IMPORT_FEATURES = 50_000;
/** Largest import body accepted; larger ones are refused with 413 before parsing. */
export const MAX_IMPORT_BYTES = 20 * 1024 * 1024;

const MAX_ISSUES = 20;

/** What an import would add: the shapes (with fresh ids) and how many of each kind. */
export type ImportPlan = {
  readonly shapes: readonly (NewShapeInput & { id: string })[];
  readonly counts: Readonly<Partial<Record<MarkupKind, number>>>;
  /** Wire bonds whose padId named a pad not in the file: their link was cleared. */
  readonly unlinkedWireBonds: number;
};

function refused(issues: InputIssue[]): InputFailure {
  const first = issues[0];
  const m = /^features\.(\d+)(?:\.(.*))?$/.exec(first.path);
  const where = m ? `feature ${m[1]}${m[2] ? `: ${m[2]}` : ""}` : first.path;
  return { message: `Invalid GeoJSON: ${where ? `${where}: ` : ""}${first.message}`, issues: issues.slice(0, MAX_ISSUES) };
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/** The zod path of a shape mapped back onto the feature (`kind` sits inside properties). */
function featurePath(index: number, path: readonly PropertyKey[]): string {
  const parts = path.map(String);
  if (parts[0] === "kind") parts.unshift("properties");
  return ["features", index, ...parts].join(".");
}

function zodIssues(error: z.ZodError, index: number): InputIssue[] {
  return error.issues.map((i) => ({ path: featurePath(index, i.path), message: i.message }));
}

/** Checks one feature's envelope and turns it into a shape to validate, or names what is wrong. */
function envelope(f: unknown, index: number): { shape: Record<string, unknown>; sourceId: unknown } | InputIssue {
  const at = (p: string, message: string) => ({ path: `features.${index}${p ? `.${p}` : ""}`, message });
  if (!isObject(f)) return at("", "must be a GeoJSON Feature object");
  if (f.type !== "Feature") return at("type", 'must be "Feature"');
  if (f.geometry === undefined || f.geometry === null) return at("geometry", "is required (a feature without geometry cannot be markup)");
  if (!isObject(f.properties)) return at("properties", `must be an object holding at least "kind" (one of ${MARKUP_KINDS.join(", ")})`);
  const { kind, ...properties } = f.properties;
  if (kind === undefined) return at("properties.kind", `is required (one of ${MARKUP_KINDS.join(", ")})`);
  return { shape: { kind, geometry: f.geometry, properties }, sourceId: f.id };
}

function collection(body: unknown): unknown[] | InputIssue {
  if (!isObject(body)) return { path: "", message: "the file must be a GeoJSON FeatureCollection object" };
  if (body.type !== "FeatureCollection") return { path: "type", message: 'must be "FeatureCollection"' };
  if (!Array.isArray(body.features)) return { path: "features", message: "must be a list of features" };
  if (body.features.length === 0) return { path: "features", message: "the collection holds no features" };
  if (body.features.length > MAX_IMPORT_FEATURES) {
    return { path: "features", message: `holds ${body.features.length} features; one import takes at most ${MAX_IMPORT_FEATURES}` };
  }
  return body.features;
}

/**
 * Reads a GeoJSON FeatureCollection of markup and validates every feature exactly as the markup
 * API validates a shape (`newShapeSchema`), plus the die's bounds. All or nothing: any bad feature
 * refuses the whole file, the message naming the first bad feature's index and why. Shapes get new
 * ids; a wire bond's padId naming a pad of the same file follows that pad to its new id.
 */
export function parseMarkupImport(body: unknown, bounds: DieBounds, newId: () => string = randomUUID): Parsed<ImportPlan> {
  const features = collection(body);
  if (!Array.isArray(features)) return { ok: false, failure: refused([features]) };
  const issues: InputIssue[] = [];
  const parsed: { shape: NewShapeInput; sourceId: unknown }[] = [];
  for (let i = 0; i < features.length && issues.length < MAX_ISSUES; i++) {
    const e = envelope(features[i], i);
    if ("message" in e) {
      issues.push(e);
      continue;
    }
    const r = newShapeSchema.safeParse({ ...e.shape, id: undefined });
    if (!r.success) {
      issues.push(...zodIssues(r.error, i));
      continue;
    }
    const outside = firstPositionOutside(r.data.geometry, bounds);
    if (outside)
      issues.push({ path: ["features", i, "geometry", ...outside].join("."), message: `lies outside the die and its margin (${describeBounds(bounds)})` });
    else parsed.push({ shape: r.data, sourceId: e.sourceId });
  }
  if (issues.length > 0) return { ok: false, failure: refused(issues) };
  return { ok: true, value: plan(parsed, newId) };
}

function plan(parsed: { shape: NewShapeInput; sourceId: unknown }[], newId: () => string): ImportPlan {
  const ids = new Map<string, string>();
  const withIds = parsed.map(({ shape, sourceId }) => {
    const id = newId();
    if (typeof sourceId === "string" || typeof sourceId === "number") ids.set(String(sourceId).toLowerCase(), id);
    return { ...shape, id };
  });
  let unlinkedWireBonds = 0;
  const counts: Partial<Record<MarkupKind, number>> = {};
  const shapes = withIds.map((s) => {
    counts[s.kind] = (counts[s.kind] ?? 0) + 1;
    if (s.kind !== "wire_bond" || !s.properties.padId) return s;
    const padId = ids.get(s.properties.padId.toLowerCase()) ?? null;
    if (padId === null) unlinkedWireBonds++;
    return { ...s, properties: { ...s.properties, padId } };
  });
  return { shapes, counts, unlinkedWireBonds };
}
