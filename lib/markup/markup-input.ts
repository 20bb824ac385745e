import type { z } from "zod";
import { MAX_BATCH, newShapeSchema, type NewShapeInput } from "@/lib/validation/markup";
import type { Geometry } from "@/lib/geometry/types";
import { describeBounds, firstPositionOutside, type DieBounds } from "./die-bounds";
import type { MarkupKind } from "./types";

/** One refused field: the dotted path from the body's root and what is wrong. */
export type InputIssue = { readonly path: string; readonly message: string };

/** Why a markup body was refused: a message naming the first failing path, and the issues. */
export type InputFailure = { readonly message: string; readonly issues: readonly InputIssue[] };

export type Parsed<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly failure: InputFailure };

/** A body refused for thousands of items would otherwise answer with thousands of issues. */
const MAX_ISSUES = 20;

function failure(issues: InputIssue[], batch: boolean): InputFailure {
  const first = issues[0];
  let where = first?.path ?? "";
  if (batch && where !== "") {
    const [index, ...rest] = where.split(".");
    where = rest.length > 0 ? `item ${index}: ${rest.join(".")}` : `item ${index}`;
  }
  const summary = first ? `${where ? `${where}: ` : ""}${first.message}` : "invalid input";
  return { message: `Invalid body: ${summary}`, issues: issues.slice(0, MAX_ISSUES) };
}

function zodIssues(error: z.ZodError, prefix: (string | number)[] = []): InputIssue[] {
  return error.issues.map((i) => ({ path: [...prefix, ...i.path].map(String).join("."), message: i.message }));
}

/**
 * Reads the body of POST /api/dies/{dieId}/markup: one shape, or an array of 1 to 10,000.
 * For an array the message names the index of the first failing item; ids within an array
 * must not repeat.
 */
export function parseNewShapes(body: unknown): Parsed<{ batch: boolean; shapes: NewShapeInput[] }> {
  if (!Array.isArray(body)) {
    const r = newShapeSchema.safeParse(body);
    return r.success ? { ok: true, value: { batch: false, shapes: [r.data] } } : { ok: false, failure: failure(zodIssues(r.error), false) };
  }
  if (body.length === 0) return { ok: false, failure: failure([{ path: "", message: "send at least one shape" }], false) };
  if (body.length > MAX_BATCH) return { ok: false, failure: failure([{ path: "", message: `send at most ${MAX_BATCH} shapes at once` }], false) };
  const issues: InputIssue[] = [];
  const shapes: NewShapeInput[] = [];
  const seen = new Map<string, number>();
  body.forEach((item, index) => {
    const r = newShapeSchema.safeParse(item);
    if (!r.success) {
      issues.push(...zodIssues(r.error, [index]));
      return;
    }
    const id = r.data.id?.toLowerCase();
    if (id !== undefined && seen.has(id)) issues.push({ path: `${index}.id`, message: `repeats the id of item ${seen.get(id)}` });
    if (id !== undefined) seen.set(id, index);
    shapes.push(r.data);
  });
  return issues.length > 0 ? { ok: false, failure: failure(issues, true) } : { ok: true, value: { batch: true, shapes } };
}

/**
 * Re-checks a shape after a PATCH merged the client's geometry and properties into the stored
 * shape: the kind is the stored one, so geometry must still match it and properties must be
 * complete and valid for it.
 */
export function parseShapeOfKind(kind: MarkupKind, geometry: unknown, properties: unknown): Parsed<NewShapeInput> {
  const r = newShapeSchema.safeParse({ kind, geometry, properties });
  return r.success ? { ok: true, value: r.data } : { ok: false, failure: failure(zodIssues(r.error), false) };
}

/**
 * Checks that every shape lies within the die's bounds (die plus margin). Returns the failure
 * naming the first position outside, or null.
 */
export function checkInsideDie(geometries: readonly Geometry[], bounds: DieBounds, batch: boolean): InputFailure | null {
  for (let i = 0; i < geometries.length; i++) {
    const path = firstPositionOutside(geometries[i], bounds);
    if (!path) continue;
    const full = [...(batch ? [i] : []), "geometry", ...path].join(".");
    return failure([{ path: full, message: `lies outside the die and its margin (${describeBounds(bounds)})` }], batch);
  }
  return null;
}
