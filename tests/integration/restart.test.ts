import { describe, expect, inject, it } from "vitest";
import { startServer, tempDataDir } from "../support/server";
import { demoClients } from "../support/client";

// The embedded database lives on disk; a second server on the same data dir must refuse.
describe.skipIf(inject("databaseKind") === "postgres")("restart and data-dir lock (PGlite)", () => {
  it("keeps data across a restart, and a second server on the same data dir refuses to start", async () => {
    const dataDir = tempDataDir();
    const first = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
    const { owner } = await demoClients(first.url);
    const teamId = (await owner.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
    const created = await owner.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Survives a restart" });
    expect(created.status).toBe(201);

    const second = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } }).then(
      () => null,
      (e: Error & { exitCode?: number; logs?: string }) => e,
    );
    expect(second?.exitCode).toBe(1);
    expect(second?.logs).toMatch(/in use by another Kerfline server/);
    // The first keeps working.
    expect((await owner.get(`/api/cases/${created.body.id}`)).status).toBe(200);

    await first.stop();
    const again = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
    try {
      const { owner: owner2 } = await demoClients(again.url);
      const res = await owner2.get<{ title: string }>(`/api/cases/${created.body.id}`);
      expect(res.status).toBe(200);
      expect(res.body.title).toBe("Survives a restart");
      expect((await owner2.get<unknown[]>("/api/cases")).body).toHaveLength(2);
    } finally {
      await again.stop();
    }
  });

  it("starts again at once after the server was killed (the stale lock is taken over)", async () => {
    const dataDir = tempDataDir();
    const first = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
    await first.kill();
    const again = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
    expect((await fetch(`${again.url}/api/health`)).status).toBe(200);
    await again.stop();
  });
});
