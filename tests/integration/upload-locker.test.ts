import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { SharedUploadLocker } from "@/server/uploads/shared-locker";
import { freshPostgresDatabase } from "../support/postgres";

// Two lockers on two pools stand for two web servers on one PostgreSQL: requests on one upload
// take turns across them. Semantics relied on (PostgreSQL 15 docs, "Advisory Locks"): a
// session-level advisory lock is held until released or the session ends; pg_try_advisory_lock
// answers false at once when another session holds it.
const engine = process.env.KERFLINE_TEST_DATABASE_URL ? "postgres" : "pglite";

describe.skipIf(engine !== "postgres")("the shared upload locker", () => {
  let a: pg.Pool;
  let b: pg.Pool;
  beforeAll(async () => {
    const url = await freshPostgresDatabase("upload_locker");
    a = new pg.Pool({ connectionString: url, max: 2 });
    b = new pg.Pool({ connectionString: url, max: 2 });
  });
  afterAll(async () => {
    await a?.end();
    await b?.end();
  });

  it("lets a request on another server wait until the first lets go, and never both at once", async () => {
    const onA = new SharedUploadLocker(a).newLock("upload-1");
    const onB = new SharedUploadLocker(b).newLock("upload-1");
    await onA.lock(new AbortController().signal, async () => {});
    let bHas = false;
    const waiting = onB.lock(new AbortController().signal, async () => {}).then(() => (bHas = true));
    await new Promise((r) => setTimeout(r, 400));
    expect(bHas).toBe(false);
    await onA.unlock();
    await waiting;
    expect(bHas).toBe(true);
    // Another upload's lock is independent.
    const other = new SharedUploadLocker(a).newLock("upload-2");
    await other.lock(new AbortController().signal, async () => {});
    await other.unlock();
    await onB.unlock();
  });

  it("gives up with tus's lock timeout when the request is stopped, leaving the lock to its holder", async () => {
    const holder = new SharedUploadLocker(a).newLock("upload-3");
    await holder.lock(new AbortController().signal, async () => {});
    const stop = new AbortController();
    const waiter = new SharedUploadLocker(b, 5_000).newLock("upload-3").lock(stop.signal, async () => {});
    setTimeout(() => stop.abort(), 300);
    await expect(waiter).rejects.toMatchObject({ body: "failed to acquire lock before timeout" });
    await holder.unlock();
    const again = new SharedUploadLocker(b).newLock("upload-3");
    await again.lock(new AbortController().signal, async () => {});
    await again.unlock();
  });
});
