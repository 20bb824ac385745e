import "server-only";
import { asc, eq } from "drizzle-orm";
import { caseSamples, custodyEvents, dies, users, type CaseSampleRow, type CustodyEventRow } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { loadCase } from "./cases";
import { recordAudit } from "./audit";
import type { CustodyEventDto, SampleRecordDto } from "@/lib/dto/sample";
import type { CustodyEntryOutput, SampleRecordOutput } from "@/lib/validation/sample";

/** What a case without a saved record answers: nothing known yet. */
const EMPTY_RECORD: SampleRecordDto = { receivedAt: null, receivedFrom: "", condition: "", storageLocation: "", preparation: [] };

function recordDto(row: CaseSampleRow | undefined): SampleRecordDto {
  if (!row) return { ...EMPTY_RECORD, preparation: [] };
  return {
    receivedAt: row.receivedAt?.toISOString() ?? null,
    receivedFrom: row.receivedFrom,
    condition: row.condition,
    storageLocation: row.storageLocation,
    preparation: row.preparation,
  };
}

function custodyDto(row: CustodyEventRow): CustodyEventDto {
  return {
    id: row.id,
    action: row.action,
    to: row.to,
    location: row.location,
    note: row.note,
    actorId: row.actorId,
    actorName: row.actorName,
    at: row.at.toISOString(),
  };
}

async function readRecord(db: Db, caseId: string): Promise<CaseSampleRow | undefined> {
  return (await db.select().from(caseSamples).where(eq(caseSamples.caseId, caseId)))[0];
}

/** Oldest first by server time; entries of one instant in the order they were made. */
async function custodyOf(db: Db, caseId: string): Promise<CustodyEventDto[]> {
  const rows = await db.select().from(custodyEvents).where(eq(custodyEvents.caseId, caseId)).orderBy(asc(custodyEvents.at), asc(custodyEvents.seq));
  return rows.map(custodyDto);
}

/** The case's sample record (any member); the empty record when none was saved yet. */
export async function getSampleRecord(db: Db, actor: Actor, caseId: string): Promise<SampleRecordDto> {
  await loadCase(db, actor, caseId, "read");
  return recordDto(await readRecord(db, caseId));
}

/** Writes the whole sample record (owner/analyst), with its audit event in the same transaction. */
export async function putSampleRecord(db: Db, actor: Actor, caseId: string, input: SampleRecordOutput): Promise<SampleRecordDto> {
  return db.transaction(async (tx) => {
    const { row: c } = await loadCase(tx, actor, caseId, "edit");
    const before = await readRecord(tx, caseId);
    const values = { ...input, receivedAt: input.receivedAt ? new Date(input.receivedAt) : null, updatedBy: actor.userId, updatedAt: new Date() };
    const [after] = await tx
      .insert(caseSamples)
      .values({ caseId, ...values })
      .onConflictDoUpdate({ target: caseSamples.caseId, set: values })
      .returning();
    await recordAudit(tx, actor, { teamId: c.teamId, action: "sample.updated", entityType: "case_sample", entityId: caseId, before: before ?? null, after });
    return recordDto(after);
  });
}

/** The chain of custody of a case (any member), oldest first by server time. */
export async function listCustody(db: Db, actor: Actor, caseId: string): Promise<CustodyEventDto[]> {
  await loadCase(db, actor, caseId, "read");
  return custodyOf(db, caseId);
}

/**
 * Appends one custody entry (owner/analyst). Who and when come from the session and the
 * database clock, never from the request; there is no way to change or remove an entry.
 */
export async function appendCustody(db: Db, actor: Actor, caseId: string, input: CustodyEntryOutput): Promise<CustodyEventDto> {
  return db.transaction(async (tx) => {
    const { row: c } = await loadCase(tx, actor, caseId, "edit");
    const [me] = await tx.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
    const [row] = await tx
      .insert(custodyEvents)
      .values({ caseId, ...input, actorId: actor.userId, actorName: me?.name ?? "unknown" })
      .returning();
    await recordAudit(tx, actor, { teamId: c.teamId, action: "custody.appended", entityType: "custody_event", entityId: row.id, after: row });
    return custodyDto(row);
  });
}

/**
 * The sample record and custody log of the case a die belongs to, for the die report. No
 * authorization here: the report's loader has checked the caller's right on the die.
 */
export async function sampleOfDie(db: Db, dieId: string): Promise<{ record: SampleRecordDto; custody: CustodyEventDto[] }> {
  const [die] = await db.select({ caseId: dies.caseId }).from(dies).where(eq(dies.id, dieId));
  if (!die) return { record: recordDto(undefined), custody: [] };
  return { record: recordDto(await readRecord(db, die.caseId)), custody: await custodyOf(db, die.caseId) };
}
