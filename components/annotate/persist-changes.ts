import type { AnyShape } from "@/lib/markup/types";
import { apiFetch } from "@/lib/client/api";

export type Change = { readonly before: AnyShape | null; readonly after: AnyShape | null };

/**
 * Sends one committed editor entry to the API, shape by shape, in order: a new shape is a POST
 * (with its client-made id, so undoing a delete brings the same id back), a changed one a PATCH
 * with the version the server last gave us, a removed one a DELETE. Returns the server's
 * shapes (to echo into the editor) and the ids it removed.
 */
export async function persistEntry(dieId: string, entry: readonly Change[], versions: Map<string, number>): Promise<{ saved: AnyShape[]; removed: string[] }> {
  const saved: AnyShape[] = [];
  const removed: string[] = [];
  const creates = entry.filter((c) => !c.before && c.after).map((c) => c.after!);
  if (creates.length > 0) {
    const body = creates.map((s) => ({ id: s.id, kind: s.kind, geometry: s.geometry, properties: s.properties }));
    const out = await apiFetch<AnyShape[]>(`/api/dies/${dieId}/markup`, { method: "POST", body });
    for (const s of out) versions.set(s.id, s.version);
    saved.push(...out);
  }
  for (const c of entry) {
    if (c.before && c.after) {
      const version = versions.get(c.after.id) ?? c.before.version;
      const s = await apiFetch<AnyShape>(`/api/markup/${c.after.id}`, {
        method: "PATCH",
        body: { version, geometry: c.after.geometry, properties: c.after.properties },
      });
      versions.set(s.id, s.version);
      saved.push(s);
    } else if (c.before && !c.after) {
      await apiFetch(`/api/markup/${c.before.id}`, { method: "DELETE" });
      versions.delete(c.before.id);
      removed.push(c.before.id);
    }
  }
  return { saved, removed };
}
