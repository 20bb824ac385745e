import { beforeAll, describe, expect, inject, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import { makeJpeg, uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";

// Issue #13 item 7: every kind of answer carries the security headers (values as the OWASP
// Secure Headers Project recommends); pages get a nonce policy that forbids framing.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
let micrographId: string;
const base = () => inject("baseUrl");

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId));
  const up = await world.clients.owner.upload<{ id: string }>(`/api/dies/${dieId}/micrographs`, uploadForm(await makeJpeg(700, 500), "die.jpg"));
  micrographId = up.body.id;
  await waitForStatus(world.clients.owner, micrographId, "ready");
});

function expectCommon(h: Headers, what: string) {
  expect(h.get("x-content-type-options"), what).toBe("nosniff");
  expect(h.get("referrer-policy"), what).toBe("strict-origin-when-cross-origin");
  expect(h.get("permissions-policy"), what).toMatch(/camera=\(\)/);
  expect(h.get("content-security-policy"), what).toMatch(/frame-ancestors 'none'/);
}

function expectPagePolicy(h: Headers, html: string, what: string) {
  expectCommon(h, what);
  const csp = h.get("content-security-policy")!;
  const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
  expect(nonce, what).toBeTruthy();
  expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
  expect(csp).not.toMatch(/'unsafe-eval'/);
  // Every inline script Next.js writes carries this request's nonce.
  const scripts = [...html.matchAll(/<script\b([^>]*)>/g)].map((m) => m[1]);
  expect(scripts.length, what).toBeGreaterThan(0);
  for (const attrs of scripts) expect(attrs, what).toContain(`nonce="${nonce}"`);
}

describe("security headers on every page type", () => {
  const page = async (path: string, cookie = "") => {
    const res = await fetch(`${base()}${path}`, { redirect: "manual", headers: { cookie } });
    return { res, html: await res.text() };
  };

  it("sign-in page", async () => {
    const { res, html } = await page("/sign-in");
    expect(res.status).toBe(200);
    expectPagePolicy(res.headers, html, "sign-in");
  });

  it("case list and die page", async () => {
    for (const path of ["/cases", `/dies/${dieId}`]) {
      const { res, html } = await page(path, world.clients.owner.cookie);
      expect(res.status, path).toBe(200);
      expectPagePolicy(res.headers, html, path);
    }
  });

  it("API answers and tiles", async () => {
    // The first full-resolution tile of a 700 × 500 image in 512-px tiles (IIIF Image API 3.0
    // implementation notes: w = min(512, 700), h = min(512, 500)).
    const tile = `/api/micrographs/${micrographId}/iiif/0,0,512,500/512,500/0/default.jpg`;
    for (const path of ["/api/me", `/api/micrographs/${micrographId}/iiif/info.json`, tile, `/api/micrographs/${micrographId}/thumbnail`]) {
      const res = await world.clients.owner.request("GET", path);
      expect(res.status, path).toBe(200);
      expectCommon(res.headers, path);
      expect(res.headers.get("content-security-policy"), path).toMatch(/default-src 'none'/);
    }
  });

  it("the redirect from / carries no Set-Cookie and is not stored by caches", async () => {
    for (const cookie of ["", world.clients.owner.cookie]) {
      const res = await fetch(`${base()}/`, { redirect: "manual", headers: { cookie } });
      expect(res.status).toBeGreaterThanOrEqual(300);
      expect(res.status).toBeLessThan(400);
      expect(res.headers.getSetCookie()).toEqual([]);
      expect(res.headers.get("cache-control")).toMatch(/no-store/);
      expectCommon(res.headers, "/");
    }
  });

  it("a signed-out visit is redirected with the headers and no cacheable cookie", async () => {
    const res = await fetch(`${base()}/cases`, { redirect: "manual" });
    expect(res.status).toBe(307);
    expect(res.headers.get("location")).toMatch(/\/sign-in\?callbackUrl=/);
    expect(res.headers.get("cache-control")).toMatch(/no-store/);
    expectCommon(res.headers, "redirect");
  });
});
