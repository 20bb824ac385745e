// The one-line text of an inbox item: who did what on which die, and the start of what they wrote.
import { actionPhrase, type ReviewAction } from "./review-status";

/** Longest excerpt of a comment or review message kept in an inbox item, in characters. */
const INBOX_EXCERPT_CHARS = 160;

/** White space collapsed, cut at a word boundary near the limit with an ellipsis. */
export function excerpt(text: string, max = INBOX_EXCERPT_CHARS): string {
  const flat = text.replace(/\s+/g, " ").trim();
  const chars = Array.from(flat); // code points, so a cut never splits a surrogate pair
  if (chars.length <= max) return flat;
  const cut = chars.slice(0, max).join("");
  const space = cut.lastIndexOf(" ");
  return `${(space > max * 0.6 ? cut.slice(0, space) : cut).trimEnd()}…`;
}

export type InboxEvent =
  | { kind: "mention" | "comment"; author: string; dieName: string; body: string }
  | { kind: "review"; action: ReviewAction; author: string; dieName: string; message: string };

/** The text shown for an event in the inbox. */
export function inboxText(e: InboxEvent): string {
  if (e.kind !== "review")
    return `${e.author} ${e.kind === "mention" ? "named you in a remark on" : "replied to a remark on"} ${e.dieName}: ${excerpt(e.body)}`;
  const what = actionPhrase(e.action, e.dieName);
  const said = excerpt(e.message);
  return said ? `${e.author} ${what}: ${said}` : `${e.author} ${what}`;
}
