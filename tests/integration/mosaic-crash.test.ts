import fs from "node:fs";
import path from "node:path";
import { describe, expect, inject, it } from "vitest";
import { startServer, tempDataDir } from "../support/server";
import { demoClients } from "../support/client";
import { cutMosaic, mosaicForm } from "../support/mosaic-frames";
import type { MicrographDto } from "@/lib/dto/micrographs";

type Client = Awaited<ReturnType<typeof demoClients>>["analyst"];

/** Polls the micrograph until `done` holds; throws on failure or after the timeout. */
async function waitFor(client: Client, id: string, done: (m: MicrographDto) => boolean, timeoutMs: number): Promise<MicrographDto> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const m = (await client.get<MicrographDto>(`/api/micrographs/${id}`)).body;
    if (done(m)) return m;
    if (m.status === "failed") throw new Error(`mosaic failed: ${m.error}`);
    if (Date.now() > deadline) throw new Error(`timed out at ${m.mosaic?.stage} ${m.mosaic?.stageProgress} % (${m.status})`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe.skipIf(inject("databaseKind") === "postgres")("a mosaic's stitch survives a crash (SIGKILL)", () => {
  it("never serves a half-built mosaic, and completes the stitch and tiling after a restart", async () => {
    const dataDir = tempDataDir();
    // 4 × 4 frames of 2000 × 1500 px (about 43 Mpx composed): composition takes seconds here.
    const frames = await cutMosaic({ rows: 4, cols: 4, frameWidth: 2000, frameHeight: 1500, overlap: 0.2, jitter: 12 });
    let server = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
    try {
      let { analyst } = await demoClients(server.url);
      const teamId = (await analyst.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
      const c = await analyst.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Mosaic crash case" });
      const d = await analyst.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "crash die" });
      const dieId = d.body.id;
      const up = await analyst.upload<{ id: string }>(
        `/api/dies/${dieId}/mosaics`,
        mosaicForm({ rows: "4", cols: "4", order: "rows", overlapPercent: "20", scaleUmPerPx: "0.15" }, frames),
      );
      expect(up.status).toBe(202);
      const id = up.body.id;

      // Kill the server while the frames are being composed.
      await waitFor(analyst, id, (m) => m.mosaic?.stage === "composing", 120_000);
      expect((await analyst.get(`/api/micrographs/${id}/iiif/info.json`)).status).toBe(409);
      await server.kill();
      // Nothing of the result is stored yet: no original, no pyramid; the work is only in scratch.
      const stored = (area: string) => (fs.existsSync(path.join(dataDir, area, dieId)) ? fs.readdirSync(path.join(dataDir, area, dieId)) : []);
      expect(stored("originals").filter((n) => n.startsWith(id))).toEqual([]);
      expect(stored("tiles").filter((n) => n.startsWith(id))).toEqual([]);
      expect(fs.readdirSync(path.join(dataDir, "scratch")).some((n) => n.startsWith("stitch-"))).toBe(true);
      // The frames stay for the retry.
      expect(fs.readdirSync(path.join(dataDir, "mosaics", dieId, id))).toHaveLength(16);

      server = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
      ({ analyst } = await demoClients(server.url));
      const ready = await waitFor(analyst, id, (m) => m.status === "ready" && m.mosaic?.stage === "done", 240_000);
      expect(server.logs()).toMatch(/picked up 1 job/);
      expect(ready.mosaic?.frames).toHaveLength(16);
      // Placement accuracy is the engine's tests' subject (server/images/mosaic); this test is about the crash.
      const info = await analyst.get<{ width: number; height: number }>(`/api/micrographs/${id}/iiif/info.json`);
      expect(info.status).toBe(200);
      expect([info.body.width, info.body.height]).toEqual([ready.width, ready.height]);
      // The killed attempt's folder was swept at start, the finished one removed.
      expect(fs.readdirSync(path.join(dataDir, "scratch")).filter((n) => n.startsWith("stitch-") || n.startsWith("tiling-"))).toEqual([]);
    } finally {
      await server.stop();
    }
  }, 420_000);
});
