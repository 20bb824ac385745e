import "server-only";
import { ERRORS, MemoryLocker, type Lock, type Locker, type RequestRelease } from "@tus/server";
import type { Pool, PoolClient } from "pg";

/** Advisory-lock namespace of resumable uploads (the two-key form; any constant, "tus" in ASCII). */
const NAMESPACE = 0x747573;
const POLL_MS = 100;

/**
 * A tus locker for several web servers on one bucket: requests on one upload (a client's retry
 * landing on another server while its first PATCH still runs there) take turns. Within the
 * process the memory locker (which asks the holder to let go early, as tus expects); across
 * processes a PostgreSQL advisory lock on a connection of its own, held until unlock, polled
 * with pg_try_advisory_lock so a stopped request never waits in the database.
 */
export class SharedUploadLocker implements Locker {
  private readonly local = new MemoryLocker();

  constructor(
    private readonly pool: Pool,
    private readonly timeoutMs = 30_000,
  ) {}

  newLock(id: string): Lock {
    const local = this.local.newLock(id);
    const { pool, timeoutMs } = this;
    let held: PoolClient | null = null;
    return {
      async lock(signal: AbortSignal, requestRelease: RequestRelease) {
        await local.lock(signal, requestRelease);
        const client = await pool.connect().catch(async (e) => {
          await local.unlock();
          throw e;
        });
        try {
          const deadline = Date.now() + timeoutMs;
          for (;;) {
            const r = await client.query<{ ok: boolean }>("select pg_try_advisory_lock($1, hashtext($2)) as ok", [NAMESPACE, id]);
            if (r.rows[0]?.ok) break;
            if (signal.aborted || Date.now() > deadline) throw ERRORS.ERR_LOCK_TIMEOUT;
            await new Promise((resolve) => setTimeout(resolve, POLL_MS));
          }
          held = client;
        } catch (e) {
          client.release();
          await local.unlock();
          throw e;
        }
      },
      async unlock() {
        const client = held;
        held = null;
        if (client) {
          // A connection whose unlock failed is dropped, which ends its session and its locks.
          const ok = await client.query("select pg_advisory_unlock($1, hashtext($2))", [NAMESPACE, id]).then(
            () => true,
            () => false,
          );
          client.release(!ok);
        }
        await local.unlock();
      },
    };
  }
}
