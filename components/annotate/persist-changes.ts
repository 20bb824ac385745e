import type { AnyShape } from "@/lib/markup/types";
import { apiFetch } from "@/lib/client/api";
import type { Editor } from "./editor/types";

export type Change = { readonly before: AnyShape | null; readonly after: AnyShape | null };

/** A server answer with the shape our request sent for it. */
type Echo = { readonly shape: AnyShape; readonly sent: AnyShape | null };

/**
 * Sends one committed editor entry to the API, shape by shape, in order: a new shape is a POST
 * (with its client-made id, so undoing a delete brings the same id back), a changed one a PATCH
 * with the version the server last gave us, a removed one a DELETE. Returns the server's
 * shapes with what was sent for each (to echo into the editor) and the ids it removed.
 */
async function persistEntry(dieId: string, entry: readonly Change[], versions: Map<string, number>): Promise<{ saved: Echo[]; removed: string[] }> {
  const saved: Echo[] = [];
  const removed: string[] = [];
  const creates = entry.filter((c) => !c.before && c.after).map((c) => c.after!);
  if (creates.length > 0) {
    const body = creates.map((s) => ({ id: s.id, kind: s.kind, geometry: s.geometry, properties: s.properties }));
    const out = await apiFetch<AnyShape[]>(`/api/dies/${dieId}/markup`, { method: "POST", body });
    const sent = new Map(creates.map((s) => [s.id, s]));
    for (const s of out) {
      versions.set(s.id, s.version);
      saved.push({ shape: s, sent: sent.get(s.id) ?? null });
    }
  }
  for (const c of entry) {
    if (c.before && c.after) {
      const version = versions.get(c.after.id) ?? c.before.version;
      const s = await apiFetch<AnyShape>(`/api/markup/${c.after.id}`, {
        method: "PATCH",
        body: { version, geometry: c.after.geometry, properties: c.after.properties },
      });
      versions.set(s.id, s.version);
      saved.push({ shape: s, sent: c.after });
    } else if (c.before && !c.after) {
      await apiFetch(`/api/markup/${c.before.id}`, { method: "DELETE" });
      versions.delete(c.before.id);
      removed.push(c.before.id);
    }
  }
  return { saved, removed };
}

/** Persists one entry and writes the server's answers back into the editor. */
export async function saveEntry(
  editor: Pick<Editor, "applyServerShape">,
  dieId: string,
  entry: readonly Change[],
  versions: Map<string, number>,
): Promise<void> {
  const { saved } = await persistEntry(dieId, entry, versions);
  // Each answer is merged with `sent`, so an edit made while the request was in flight survives.
  for (const { shape, sent } of saved) editor.applyServerShape(shape, sent);
}
