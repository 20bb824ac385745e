/** A team member as mentions see them. */
export type Mentionable = { readonly userId: string; readonly name: string; readonly email: string };

function boundaryBefore(text: string, at: number): boolean {
  return at === 0 || /[\s(\[]/.test(text[at - 1]);
}

function endsWord(text: string, end: number): boolean {
  const next = text[end];
  return next === undefined || !/[\p{L}\p{N}_@]/u.test(next);
}

/**
 * The team members a comment mentions: `@` followed by a member's e-mail or display name
 * (case-insensitive, longest match wins, whole words only). Text that names nobody in the team
 * mentions nobody, so a comment can never notify an outsider.
 */
export function resolveMentions(body: string, members: readonly Mentionable[]): string[] {
  const found = new Set<string>();
  const lower = body.toLowerCase();
  for (let at = lower.indexOf("@"); at !== -1; at = lower.indexOf("@", at + 1)) {
    if (!boundaryBefore(body, at)) continue;
    let best: { userId: string; length: number } | null = null;
    for (const m of members) {
      for (const key of [m.email, m.name]) {
        const k = key.trim().toLowerCase();
        if (!k || !lower.startsWith(k, at + 1) || !endsWord(lower, at + 1 + k.length)) continue;
        if (!best || k.length > best.length) best = { userId: m.userId, length: k.length };
      }
    }
    if (best) found.add(best.userId);
  }
  return [...found];
}

/**
 * The partial mention being typed at the caret (`@de` → "de"), for autocomplete; null when
 * the caret is not inside one.
 */
export function mentionQueryAt(text: string, caret: number): { start: number; query: string } | null {
  const before = text.slice(0, caret);
  const at = before.lastIndexOf("@");
  if (at === -1 || !boundaryBefore(text, at)) return null;
  const query = before.slice(at + 1);
  if (query.length > 40 || /\n/.test(query) || /\s\S*\s/.test(query)) return null;
  return { start: at, query };
}
