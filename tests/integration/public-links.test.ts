import http from "node:http";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import { DEMO_EMAILS } from "../support/client";
import { makeJpeg, uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";
import { square, waitForMail, type Thread } from "./review-support";

// Issue #13 item 6: without KERFLINE_PUBLIC_URL or KERFLINE_TRUST_PROXY=1 (as here), links
// in mail and IIIF ids point at localhost on the configured port, whatever Host or
// X-Forwarded-Host a client sends.
let world: Awaited<ReturnType<typeof demoWorld>>;
const base = () => inject("baseUrl");
// (X-Forwarded-Proto is left out: Auth.js itself then looks for the __Secure- cookie and answers 401.)
const FORGED = { "x-forwarded-host": "attacker.test" };

beforeAll(async () => {
  world = await demoWorld();
});

/** A request with a forged Host header (fetch will not send one of our choosing). */
function getWithHost(path: string, host: string, cookie: string): Promise<{ status: number; body: string }> {
  const u = new URL(base());
  return new Promise((resolve, reject) => {
    const r = http.request({ hostname: u.hostname, port: u.port, path, headers: { host, cookie } }, (res) => {
      let body = "";
      res.on("data", (d) => (body += d));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    });
    r.on("error", reject);
    r.end();
  });
}

describe("links do not follow forged Host or X-Forwarded-Host headers", () => {
  it("mails a mention with a link to the configured origin", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await world.clients.reviewer.request<Thread>(
      "POST",
      `/api/dies/${dieId}/threads`,
      { region: square(100, 100), body: "@Demo Analyst check the bond on VB1" },
      { ...FORGED, host: "attacker.test" },
    );
    expect(t.status).toBe(201);
    const mail = await waitForMail(world.clients.owner, DEMO_EMAILS.analyst, (m) => m.subject.includes("named you in a remark"), `?thread=${t.body.id}`);
    expect(mail.text).toContain(`${base()}/dies/${dieId}?thread=${t.body.id}`);
    expect(mail.text).not.toContain("attacker.test");
  });

  it("writes the configured origin into info.json's id", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const up = await world.clients.owner.upload<{ id: string }>(`/api/dies/${dieId}/micrographs`, uploadForm(await makeJpeg(700, 500), "die.jpg"));
    expect(up.status).toBe(202);
    await waitForStatus(world.clients.owner, up.body.id, "ready");
    const forwarded = await world.clients.owner.request<{ id: string }>("GET", `/api/micrographs/${up.body.id}/iiif/info.json`, undefined, FORGED);
    expect(forwarded.body.id).toBe(`${base()}/api/micrographs/${up.body.id}/iiif`);
    const host = await getWithHost(`/api/micrographs/${up.body.id}/iiif/info.json`, "attacker.test:8080", world.clients.owner.cookie);
    expect(host.status).toBe(200);
    expect((JSON.parse(host.body) as { id: string }).id).toBe(`${base()}/api/micrographs/${up.body.id}/iiif`);
  });
});
