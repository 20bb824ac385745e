import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";
import { describe, expect, inject, it } from "vitest";
import { startServer, tempDataDir } from "../support/server";
import { demoClients } from "../support/client";
import { uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";
import { expectedTilePaths } from "@/lib/tiles/iiif";
import { readPackIndexFile } from "../support/tile-pack";

/** A 20000 × 12000 px JPEG with structure, big enough that tiling takes seconds. */
async function bigJpeg(): Promise<Buffer> {
  const tile = await sharp({ create: { width: 400, height: 400, channels: 3, background: { r: 120, g: 140, b: 100 } } })
    .composite([{ input: { create: { width: 200, height: 120, channels: 3, background: { r: 220, g: 200, b: 120 } } }, left: 60, top: 90 }])
    .png()
    .toBuffer();
  return sharp({ create: { width: 20000, height: 12000, channels: 3, background: { r: 40, g: 50, b: 45 } }, limitInputPixels: false })
    .composite([{ input: tile, tile: true, blend: "over" }])
    .jpeg({ quality: 80 })
    .toBuffer();
}

type Client = Awaited<ReturnType<typeof demoClients>>["analyst"];

/** Waits until the pyramid of `id` is under way (tiling, at least 3 %). */
/**
 * Waits until an attempt is under way. After a restart the row still shows the killed attempt's
 * progress while the retry waits out its delay, so with `killedAt` it first waits for the new
 * attempt to reset it (a kill before that would not cost an attempt). Returns the progress seen.
 */
async function waitUnderWay(analyst: Client, id: string, killedAt?: number): Promise<number> {
  const deadline = Date.now() + 90_000;
  let fresh = killedAt === undefined;
  for (;;) {
    const m = (await analyst.get<{ status: string; progress: number }>(`/api/micrographs/${id}`)).body;
    if (!fresh && m.progress < killedAt!) fresh = true;
    if (fresh && m.status === "tiling" && m.progress >= 3) return m.progress;
    if (m.status === "ready") throw new Error("tiling finished before the kill: make the test image larger");
    if (Date.now() > deadline) throw new Error(`never saw tiling under way: ${JSON.stringify(m)}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe.skipIf(inject("databaseKind") === "postgres")("tiling survives a crash (SIGKILL)", () => {
  it("never serves a partial pyramid, and completes the job after a restart", async () => {
    const dataDir = tempDataDir();
    const image = await bigJpeg();
    let server = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
    try {
      let { analyst } = await demoClients(server.url);
      const teamId = (await analyst.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
      const c = await analyst.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Crash case" });
      const d = await analyst.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "crash die" });
      const up = await analyst.upload<{ id: string }>(`/api/dies/${d.body.id}/micrographs`, uploadForm(image, "big.jpg", { scaleUmPerPx: "0.5" }));
      expect(up.status).toBe(202);
      const id = up.body.id;

      // Wait until the pyramid is under way, check it is not served, then kill the server.
      await waitUnderWay(analyst, id);
      expect((await analyst.get(`/api/micrographs/${id}/iiif/info.json`)).status).toBe(409);
      expect((await analyst.get(`/api/micrographs/${id}/iiif/0,0,512,512/512,512/0/default.jpg`)).status).toBe(409);
      await server.kill();
      const tilesDir = path.join(dataDir, "tiles", d.body.id);
      // The pyramid is one object stored last: none yet, its work only in scratch.
      expect(fs.existsSync(path.join(tilesDir, `${id}.tilepack`))).toBe(false);
      expect(fs.readdirSync(path.join(dataDir, "scratch")).some((n) => n.startsWith("tiling-"))).toBe(true);

      server = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
      ({ analyst } = await demoClients(server.url));
      const ready = await waitForStatus(analyst, id, "ready", 120_000);
      expect(ready.progress).toBe(100);
      expect(server.logs()).toMatch(/picked up 1 job/);
      // Every tile of the IIIF 3.0 algorithm is in the pack (sharp's whole-image spelling "full"), no other.
      const index = readPackIndexFile(path.join(tilesDir, `${id}.tilepack`));
      expect(Object.keys(index.tiles).sort()).toEqual(expectedTilePaths(20000, 12000, 512).sort());
      expect(fs.readdirSync(tilesDir).filter((n) => n.includes("partial"))).toEqual([]);
      // The killed run's work folder was swept at start, the finished one removed.
      expect(fs.readdirSync(path.join(dataDir, "scratch")).filter((n) => n.startsWith("tiling-"))).toEqual([]);
      expect((await analyst.get(`/api/micrographs/${id}/iiif/info.json`)).status).toBe(200);
    } finally {
      await server.stop();
    }
  }, 240_000);

  it("gives up after three kills: failed with the reason, no folder left, and the user can retry", async () => {
    const dataDir = tempDataDir();
    const image = await bigJpeg();
    let server = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
    try {
      let { analyst } = await demoClients(server.url);
      const teamId = (await analyst.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
      const c = await analyst.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Thrice-killed case" });
      const d = await analyst.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "crash die" });
      const up = await analyst.upload<{ id: string }>(`/api/dies/${d.body.id}/micrographs`, uploadForm(image, "big.jpg", { scaleUmPerPx: "0.5" }));
      expect(up.status).toBe(202);
      const id = up.body.id;
      let killedAt: number | undefined;
      for (let kill = 1; kill <= 3; kill++) {
        killedAt = await waitUnderWay(analyst, id, killedAt);
        await server.kill();
        server = await startServer({ dataDir, env: { KERFLINE_SEED: "demo-records" } });
        ({ analyst } = await demoClients(server.url));
      }
      // The start-up after the third kill fails the job; its dead letter then marks the micrograph.
      const failed = await waitForStatus(analyst, id, "failed", 60_000);
      expect(failed.status).toBe("failed");
      expect(failed.error).toMatch(/stopped 3 times/);
      expect(server.logs()).toMatch(/gave up 1 tiling job/);
      const tilesDir = path.join(dataDir, "tiles", d.body.id);
      const left = fs.existsSync(tilesDir) ? fs.readdirSync(tilesDir) : [];
      expect(left.filter((n) => n.startsWith(id))).toEqual([]);
      // The original is kept, so a retry needs no new upload.
      expect(fs.readdirSync(path.join(dataDir, "originals", d.body.id)).some((n) => n.startsWith(id))).toBe(true);

      expect((await analyst.request("POST", `/api/micrographs/${id}/retry`)).status).toBe(200);
      expect((await analyst.request<{ error: string }>("POST", `/api/micrographs/${id}/retry`)).status).toBe(409);
      const ready = await waitForStatus(analyst, id, "ready", 150_000);
      expect(ready.progress).toBe(100);
    } finally {
      await server.stop();
    }
  }, 420_000);
});
