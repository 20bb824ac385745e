import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoClients, type ApiClient } from "../support/client";
import { makeJpeg, uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";
import { startServer, type RunningServer } from "../support/server";

// Issue #13 item 13: pending exports are capped per user (default 10) and per die (here 12),
// answering 429 with a message; finished exports expire after KERFLINE_EXPORT_TTL_HOURS.
// Its own server: its queue is kept full on purpose, and the lifetime is cut to seconds.
let server: RunningServer;
let clients: Awaited<ReturnType<typeof demoClients>>;
let dieId: string;
let micrographId: string;
const TTL_HOURS = 0.002; // 7.2 s

type ExportDto = { id: string; status: string; error?: string };

beforeAll(async () => {
  server = await startServer({ env: { KERFLINE_SEED: "demo-records", KERFLINE_EXPORTS_PENDING_PER_DIE: "12", KERFLINE_EXPORT_TTL_HOURS: String(TTL_HOURS) } });
  clients = await demoClients(server.url);
  const teamId = (await clients.owner.get<{ teams: { id: string; name: string }[] }>("/api/me")).body.teams.find(
    (t) => t.name === "Fjordlight Failure Lab",
  )!.id;
  const c = await clients.owner.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Quota case" });
  const d = await clients.owner.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "quota die", widthUm: 700, heightUm: 500 });
  dieId = d.body.id;
  const up = await clients.analyst.upload<{ id: string }>(
    `/api/dies/${dieId}/micrographs`,
    uploadForm(await makeJpeg(700, 500), "die.jpg", { scaleUmPerPx: "1" }),
  );
  micrographId = up.body.id;
  await waitForStatus(clients.analyst, micrographId, "ready");
}, 180_000);

afterAll(async () => {
  await server?.stop();
});

// A large output (8192 px wide), so the single export worker is still busy while the requests arrive.
const exportAs = (who: ApiClient, widthPx = 8192) => who.request<ExportDto>("POST", `/api/dies/${dieId}/exports`, { micrographId, widthPx });

describe("export quota", () => {
  it("answers 429 for a person's 11th pending export and for the die's 13th", async () => {
    const first = await Promise.all(Array.from({ length: 11 }, () => exportAs(clients.viewer)));
    const statuses = first.map((r) => r.status).sort();
    expect(statuses).toEqual([...Array(10).fill(202), 429]);
    const refused = first.find((r) => r.status === 429)!;
    expect(refused.body.error).toMatch(/You already have 10 exports waiting or rendering \(at most 10\)/);

    // The die allows 12 pending whoever asks: the analyst gets 2 more, then 429 naming the die.
    expect((await exportAs(clients.analyst)).status).toBe(202);
    expect((await exportAs(clients.analyst)).status).toBe(202);
    const dieFull = await exportAs(clients.analyst);
    expect(dieFull.status).toBe(429);
    expect(dieFull.body.error).toMatch(/This die already has 12 exports/);
    const listed = (await clients.owner.get<ExportDto[]>(`/api/dies/${dieId}/exports`)).body;
    expect(listed.filter((e) => e.status === "queued" || e.status === "running").length).toBeLessThanOrEqual(12);
  }, 60_000);

  it("deletes an export's record and file once its lifetime has passed", async () => {
    // Wait for one export to finish, then for the sweep to expire it.
    const deadline = Date.now() + 240_000;
    let doneId: string | undefined;
    while (!doneId) {
      const list = (await clients.owner.get<ExportDto[]>(`/api/dies/${dieId}/exports`)).body;
      doneId = list.find((e) => e.status === "done")?.id;
      if (Date.now() > deadline) throw new Error("no export finished");
      if (!doneId) await new Promise((r) => setTimeout(r, 250));
    }
    const file = path.join(server.dataDir, "exports", dieId, `${doneId}.png`);
    const gone = Date.now() + 60_000;
    while ((await clients.owner.get(`/api/exports/${doneId}`)).status !== 404) {
      if (Date.now() > gone) throw new Error("the finished export was never expired");
      await new Promise((r) => setTimeout(r, 250));
    }
    expect(fs.existsSync(file)).toBe(false);
  }, 320_000);
});
