import { createHash } from "node:crypto";

/** What identifies one state of a shape: its id, its version and when that version was written. */
export type ShapeStamp = { readonly id: string; readonly version: number; readonly updatedAt: string };

/**
 * A strong entity tag for a die's markup, from the ids and versions of its shapes (and their
 * update times, so a shape deleted and re-created under the same id at version 1 still changes
 * the tag). Independent of the order the shapes come in.
 */
export function markupEtag(stamps: readonly ShapeStamp[]): string {
  const lines = stamps.map((s) => `${s.id}:${s.version}:${s.updatedAt}`).sort();
  const hash = createHash("sha256")
    .update(`${lines.length}\n${lines.join("\n")}`)
    .digest("base64url");
  return `"m-${hash.slice(0, 32)}"`;
}

function opaque(tag: string): string {
  return tag.trim().replace(/^W\//, "");
}

/**
 * Whether an If-None-Match header matches the current tag, using the weak comparison RFC 9110
 * §13.1.2 prescribes for If-None-Match: `*` matches any current representation, and a list
 * matches when any member has the same opaque tag, weak (`W/`) or not.
 */
export function ifNoneMatchMatches(header: string | null, etag: string): boolean {
  if (header === null) return false;
  const value = header.trim();
  if (value === "*") return true;
  // Entity tags are quoted and contain no commas or quotes inside (RFC 9110 §8.8.3 etagc).
  const tags = value.match(/(?:W\/)?"[^"]*"/g) ?? [];
  const wanted = opaque(etag);
  return tags.some((t) => opaque(t) === wanted);
}
