import "server-only";
import type { Database } from "@/db/client";
import { expireSearches, markedBoxes, micrographForJob, searchForJob, setSearchState } from "@/server/access/job-records";
import { assertSearchable } from "@/server/access/image-searches";
import { micrographPixels } from "@/server/images/find-similar/pixels";
import { findSimilar } from "@/server/images/find-similar/search";
import { candidateInDie, withoutMarked } from "@/lib/similar-shapes/template";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { FindSimilarResult } from "@/lib/dto/find-similar";
import type { JobHandler } from "./worker";

/** A search that cannot succeed however often it is retried (its micrograph is gone or changed). */
class SearchRefused extends Error {}

/** Finished searches are kept this long for the page to read, then swept. */
const KEEP_MS = 24 * 3600_000;

/**
 * Runs one image search: queued → running (progress from the engine) → done with the
 * candidates, best first, mapped to the die frame, without those already marked by a shape of
 * the same kind. The caller's rights were checked when the search was queued.
 */
async function runSearch(db: Database, searchId: string): Promise<void> {
  const row = await searchForJob(db, searchId);
  if (!row || row.status === "done") return;
  const found = await micrographForJob(db, row.micrographId);
  if (!found) throw new SearchRefused("The micrograph was deleted.");
  const m = assertSearchable(found);
  const p = row.params;
  await setSearchState(db, searchId, { status: "running", progress: 1, error: null });
  // Progress goes to the row in whole percent, chained so no late write lands after the result.
  let shown = 1;
  let written: Promise<unknown> = Promise.resolve();
  const onProgress = (percent: number) => {
    const pct = Math.min(99, Math.max(1, Math.round(percent)));
    if (pct <= shown) return;
    shown = pct;
    written = written.then(() => setSearchState(db, searchId, { progress: pct })).catch(() => {});
  };
  const started = performance.now();
  const src = await micrographPixels({ dieId: m.dieId, id: m.id, format: m.format, width: m.width, height: m.height });
  let search;
  try {
    search = await findSimilar(src, p.template, {
      minScore: p.minScore,
      rotations: p.rotations,
      mirrored: p.mirrored,
      region: p.region ?? undefined,
      onProgress,
    });
  } finally {
    await src.close();
  }
  const elapsedMs = Math.round(performance.now() - started);
  const imageToDie = m.transform as Affine2x3;
  const inDie = search.candidates.map((c) => candidateInDie(c, imageToDie, p.sizeUm ?? undefined));
  const result: FindSimilarResult = { candidates: withoutMarked(inDie, await markedBoxes(db, m.dieId, p.kind)), searchedPx: search.searchedPx, elapsedMs };
  await written;
  await setSearchState(db, searchId, { status: "done", progress: 100, result, finishedAt: new Date() });
}

export const findingSimilar: JobHandler = {
  kind: "find",
  run: runSearch,
  failure: (e) => `The search failed: ${(e as Error).message}`,
  final: (e) => e instanceof SearchRefused || (e as { status?: number }).status === 409,
  markFailed: (db, id, message) => setSearchState(db, id, { status: "failed", error: message, finishedAt: new Date() }),
  sweep: { everyMs: () => 3600_000, run: (db) => expireSearches(db, new Date(Date.now() - KEEP_MS)) },
};
