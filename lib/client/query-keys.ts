/**
 * Every TanStack Query key the client uses, in one place. One key names one request with one
 * result type: two hooks that want the same data share the hook that owns the key, so the cache
 * never holds an answer shaped for another reader. Keys of one die (or team, or case) start
 * with the kind of data, then the id, so `invalidateQueries` with a factory's key matches it.
 */
export const queryKeys = {
  cases: () => ["cases"] as const,
  case: (caseId: string) => ["case", caseId] as const,
  /** The dies of a case (the case page's table). */
  dies: (caseId: string) => ["dies", caseId] as const,
  /** `SampleRecordDto` of a case, and its chain of custody (`CustodyEventDto[]`). */
  sample: (caseId: string) => ["sample", caseId] as const,
  custody: (caseId: string) => ["custody", caseId] as const,
  die: (dieId: string) => ["die", dieId] as const,
  micrographs: (dieId: string) => ["micrographs", dieId] as const,
  pads: (dieId: string) => ["pads", dieId] as const,
  /** `ThreadDto[]`, owned by `useThreadList` (components/review/use-threads.ts). */
  threads: (dieId: string) => ["threads", dieId] as const,
  review: (dieId: string) => ["review", dieId] as const,
  /** `RevisionDto[]`, owned by `RevisionList` (components/review/revision-list.tsx). */
  revisions: (dieId: string) => ["revisions", dieId] as const,
  /** The die's audit trail, an infinite query. */
  activity: (dieId: string) => ["activity", dieId] as const,
  exports: (dieId: string) => ["exports", dieId] as const,
  /** The small rendering of one export request (the request's JSON is part of the key). */
  exportPreview: (dieId: string, request: string) => ["export-preview", dieId, request] as const,
  alignment: (movingMicrographId: string) => ["alignment", movingMicrographId] as const,
  members: (teamId: string) => ["members", teamId] as const,
  invitations: (teamId: string) => ["invitations", teamId] as const,
  outbox: (teamId: string) => ["outbox", teamId] as const,
  inbox: () => ["me", "inbox"] as const,
  mail: (messageId: string | null) => ["mail", messageId] as const,
};
