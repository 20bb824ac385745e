import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startServer, type RunningServer } from "../support/server";
import { ApiClient, DEMO_EMAILS } from "../support/client";

// A server of its own: locking a demo account must not disturb the other suites.
let server: RunningServer;
beforeAll(async () => {
  server = await startServer({ env: { KERFLINE_SEED: "demo-records" } });
});
afterAll(() => server?.stop());

describe("sign-in attempt limit", () => {
  it("refuses the right password after 10 failures in 15 minutes, with the minutes to wait", async () => {
    const c = new ApiClient(server.url);
    for (let i = 0; i < 10; i++) {
      expect(await c.signIn(DEMO_EMAILS.viewer, "wrong-password")).toContain("code=credentials");
    }
    const locked = await c.signIn(DEMO_EMAILS.viewer);
    expect(decodeURIComponent(locked)).toMatch(/code=too_many_attempts:(1[0-5]|[1-9])\b/);
    expect((await c.get("/api/me")).status).toBe(401);
  });

  it("counts e-mails case-insensitively and leaves other accounts alone", async () => {
    const c = new ApiClient(server.url);
    expect(decodeURIComponent(await c.signIn("VIEWER@Fjordlight.test"))).toContain("too_many_attempts");
    const other = new ApiClient(server.url);
    expect(await other.signIn(DEMO_EMAILS.reviewer)).not.toContain("error=");
    expect((await other.get("/api/me")).status).toBe(200);
  });
});

// Timing as an oracle (OWASP Authentication Cheat Sheet, "authentication responses" — common
// practice): an unknown e-mail must take about as long as a wrong password for a real account.
// Before the dummy-hash comparison the ratio here was about 0.1 (10 ms vs 99 ms).
describe("sign-in timing", () => {
  async function medianMs(email: string): Promise<number> {
    const times: number[] = [];
    for (let i = 0; i < 5; i++) {
      const c = new ApiClient(server.url);
      const t0 = performance.now();
      await c.signIn(email, "wrong-password");
      times.push(performance.now() - t0);
    }
    return times.sort((a, b) => a - b)[2];
  }
  it("does not reveal which e-mails have accounts", async () => {
    const unknown = await medianMs("nobody-here@fjordlight.test");
    const known = await medianMs(DEMO_EMAILS.analyst);
    expect(unknown / known).toBeGreaterThan(0.5);
  });
});
