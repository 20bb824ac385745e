// The activity list in words a person reads: each audit action the server records gets a verb
// phrase, and the server adds what the entry is about (`activityDetail`, from the audit row).
import { KIND_STYLE } from "@/lib/markup/palette";
import { ILLUMINATION_LABELS } from "@/lib/validation/micrographs";
import { formatUm } from "@/lib/units/format-um";

/**
 * What someone did, by audit action; `{}` is where the detail goes (at the end when absent).
 * Every action code the server records is here (activity-words.test.ts reads server/ to check).
 */
export const ACTIVITY_VERBS: Readonly<Record<string, string>> = {
  "case.created": "created the case",
  "case.updated": "changed the case",
  "case.deleted": "deleted the case",
  "die.created": "created the die",
  "die.updated": "changed the die's record",
  "die.deleted": "deleted the die",
  "die.reframed": "set the die frame from the drawn outline",
  "die.frame_restored": "put back the earlier die frame",
  "markup.created": "drew",
  "markup.updated": "changed",
  "markup.deleted": "deleted",
  "micrograph.uploaded": "uploaded",
  "micrograph.updated": "changed the capture data of",
  "micrograph.deleted": "deleted",
  "micrograph.retried": "retried the tiling of",
  "micrograph.restitched": "stitched again",
  "micrograph.aligned": "aligned",
  "micrograph.reference_changed": "made {} the reference",
  "micrograph.reordered": "changed the order of the micrographs",
  "thread.created": "raised",
  "thread.resolved": "closed",
  "thread.reopened": "reopened",
  "comment.created": "wrote",
  "comment.edited": "edited",
  "comment.deleted": "deleted",
  "review.send": "sent the die to the checker",
  "review.withdraw": "withdrew the die from the checker",
  "review.sign_off": "signed off",
  "review.return": "returned the die with remarks",
  "revision.opened": "opened",
  "invitation.created": "invited {} to the team",
  "invitation.revoked": "withdrew the invitation of",
  "invitation.accepted": "joined the team",
  "invitation.declined": "declined the invitation",
  "member.role_changed": "changed the role of a member",
  "member.removed": "removed a member from the team",
  "sample.updated": "changed the sample record",
  "custody.appended": "added a custody entry",
};

/** What the server looked up beside the audit row: the micrograph it names, the remark's number. */
export type ActivityContext = {
  readonly micrograph?: { readonly label: string; readonly illumination: string } | null;
  readonly remarkNumber?: number | null;
  /** For comment events: whether the comment is the remark's own text (its first message). */
  readonly isRemarkText?: boolean;
};

type Row = Record<string, unknown>;
const str = (v: unknown) => (typeof v === "string" ? v : "");
const quoted = (s: string, max = 140) => {
  const line = s.split("\n")[0].trim();
  return line ? `“${line.length > max ? `${line.slice(0, max - 1)}…` : line}”` : "";
};
const join = (...parts: string[]) => parts.filter(Boolean).join(" ");

function markupDetail(row: Row): string {
  const kind = str(row.kind);
  const name = KIND_STYLE[kind as keyof typeof KIND_STYLE]?.label.toLowerCase() ?? kind.replace(/_/g, " ");
  const p = (row.properties ?? {}) as Row;
  const label = str(kind === "block" ? p.name : kind === "note" ? p.text : p.label);
  return join(/^[aeiou]/.test(name) ? "an" : "a", name, quoted(label, 60));
}

function micrographDetail(action: string, row: Row, ctx: ActivityContext): string {
  const m = ctx.micrograph ?? (str(row.label) ? { label: str(row.label), illumination: str(row.illumination) } : null);
  if (!m) return "a micrograph";
  const light = ILLUMINATION_LABELS[m.illumination as keyof typeof ILLUMINATION_LABELS];
  // "bright-field micrograph": the illumination as a compound adjective; DIC, IR stay as they are.
  const adjective = light && m.illumination !== "other" ? (/^[A-Z]+$/.test(light) ? light : light.toLowerCase().replace(" ", "-")) : "";
  const what = join("the", adjective, "micrograph", quoted(m.label, 80));
  if (action !== "micrograph.aligned") return what;
  const model = str(row.alignmentModel);
  const points = Array.isArray(row.controlPoints) ? row.controlPoints.length : 0;
  const how = [model, points ? `${points} control point${points === 1 ? "" : "s"}` : ""].filter(Boolean).join(", ");
  return join(what, "to the die frame", how ? `(${how})` : "");
}

function frameDetail(row: Row): string {
  const w = Number(row.widthUm);
  const h = Number(row.heightUm);
  return Number.isFinite(w) && Number.isFinite(h) && w > 0 && h > 0 ? `(${formatUm(w, null)} × ${formatUm(h, null)} µm)` : "";
}

function commentDetail(action: string, row: Row, ctx: ActivityContext): string {
  const remark = ctx.remarkNumber ? `remark ${ctx.remarkNumber}` : "a remark";
  const what = ctx.isRemarkText ? remark : `a reply on ${remark}`;
  const said = quoted(str(row.body));
  return action === "comment.deleted" || !said ? what : `${what}: ${said}`;
}

/**
 * The detail of an activity entry from its audit row (`after`, else `before`) and what the
 * server looked up: which shape, micrograph or remark, and the words that were written.
 */
export function activityDetail(action: string, before: unknown, after: unknown, ctx: ActivityContext = {}): string {
  const row = (after ?? before ?? {}) as Row;
  const [area] = action.split(".");
  if (area === "markup") return markupDetail(row);
  if (area === "micrograph" && action !== "micrograph.reordered") return micrographDetail(action, row, ctx);
  if (action === "die.reframed" || action === "die.frame_restored") return frameDetail(row);
  if (area === "thread") return ctx.remarkNumber ? `remark ${ctx.remarkNumber}` : "a remark";
  if (area === "comment") return commentDetail(action, row, ctx);
  if (action === "review.sign_off") {
    const rev = row.revision;
    const said = quoted(str(row.message));
    const what = join(typeof rev === "number" && rev > 0 ? `revision ${rev} of the die` : "the die", row.overrideOpenRemarks ? "over open remarks" : "");
    return said ? `${what}: ${said}` : what;
  }
  if (area === "review") return quoted(str(row.message)) && `: ${quoted(str(row.message))}`;
  if (action === "revision.opened") return typeof row.revision === "number" ? `revision ${row.revision}` : "a new revision";
  if (area === "case") return quoted(str(row.title), 80);
  if (action === "invitation.created" || action === "invitation.revoked") return join(str(row.email), str(row.role) ? `as ${str(row.role)}` : "");
  if (action === "invitation.accepted") return str(row.role) ? `as ${str(row.role)}` : "";
  return "";
}

/** The sentence after the person's name: the verb phrase, then the detail. Unknown codes read as words. */
export function activitySentence(action: string, detail: string): string {
  const verb = ACTIVITY_VERBS[action] ?? action.replace(/[._]/g, " ");
  if (verb.includes("{}")) return verb.replace("{}", detail || "it").replace(/\s+/g, " ");
  return detail.startsWith(":") ? `${verb}${detail}` : join(verb, detail);
}
