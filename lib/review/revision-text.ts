import type { RevisionStamp } from "@/lib/dto/revisions";
import { REVIEW_STATUS_LABELS } from "./review-status";

/**
 * The line every export carries about its revision: "Revision 1 · signed off by Demo Reviewer,
 * 2026-12-03 14:05 UTC" or "Revision 2 · draft, not signed off". Times in UTC, minutes.
 */
export function revisionStatement(r: RevisionStamp): string {
  if (r.status === "signed_off" && r.signedOffAt) {
    return `Revision ${r.number} · signed off by ${r.signedOffBy ?? "a former member"}, ${r.signedOffAt.slice(0, 16).replace("T", " ")} UTC`;
  }
  return `Revision ${r.number} · ${REVIEW_STATUS_LABELS[r.status].toLowerCase()}, not signed off`;
}

/** The same, short enough for a file name: "rev 1 signed off 2026-12-03" or "rev 2 draft". */
export function revisionFileTag(r: RevisionStamp): string {
  return r.status === "signed_off" && r.signedOffAt
    ? `rev ${r.number} signed off ${r.signedOffAt.slice(0, 10)}`
    : `rev ${r.number} ${r.status.replace(/_/g, " ")}`;
}
