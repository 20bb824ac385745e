import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startServer, type RunningServer } from "../support/server";
import { ApiClient, DEMO_EMAILS, DEMO_PASSWORD } from "../support/client";

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

// The forwarded address stands for the client address (as a reverse proxy would send it).
const from = (address: string) => ({ "x-forwarded-for": address });
const checkedCount = (answers: string[]) => answers.filter((a) => a.includes("code=credentials")).length;
const refusedCount = (answers: string[]) => answers.filter((a) => /code=too_many_attempts%3A\d+|code=too_many_attempts:\d+/.test(a)).length;

// Before counting and recording were one locked step, 93 of 100 parallel guesses were checked.
describe("parallel guessing", () => {
  it("checks at most 10 of 100 simultaneous wrong passwords, locks that address, and the owner's known address still signs in", async () => {
    const usual = "198.51.100.7";
    const attacker = "203.0.113.9";
    expect(await new ApiClient(server.url).signIn(DEMO_EMAILS.owner, DEMO_PASSWORD, from(usual))).not.toContain("error=");
    const answers = await Promise.all(Array.from({ length: 100 }, () => new ApiClient(server.url).signIn(DEMO_EMAILS.owner, "wrong-password", from(attacker))));
    console.info(`[sign-in limit] 100 parallel guesses from one address: ${checkedCount(answers)} checked, ${refusedCount(answers)} refused`);
    expect(checkedCount(answers)).toBeLessThanOrEqual(10);
    expect(checkedCount(answers) + refusedCount(answers)).toBe(100);
    // The attacker's address is refused even with the right password, with the minutes to wait…
    const locked = await new ApiClient(server.url).signIn(DEMO_EMAILS.owner, DEMO_PASSWORD, from(attacker));
    expect(decodeURIComponent(locked)).toMatch(/code=too_many_attempts:(1[0-5]|[1-9])\b/);
    // …while the owner, from the address they signed in from before, gets in.
    const owner = new ApiClient(server.url);
    expect(await owner.signIn(DEMO_EMAILS.owner, DEMO_PASSWORD, from(usual))).not.toContain("error=");
    expect((await owner.get("/api/me")).status).toBe(200);
  });

  it("caps guesses spread over 100 addresses (or forged forwarding headers) at 10 for the account", async () => {
    const answers = await Promise.all(
      Array.from({ length: 100 }, (_, i) => new ApiClient(server.url).signIn(DEMO_EMAILS.outsider, "wrong-password", from(`192.0.2.${i + 1}`))),
    );
    console.info(`[sign-in limit] 100 parallel guesses from 100 addresses: ${checkedCount(answers)} checked, ${refusedCount(answers)} refused`);
    expect(checkedCount(answers)).toBeLessThanOrEqual(10);
    expect(checkedCount(answers) + refusedCount(answers)).toBe(100);
    const fresh = await new ApiClient(server.url).signIn(DEMO_EMAILS.outsider, DEMO_PASSWORD, from("192.0.2.200"));
    expect(decodeURIComponent(fresh)).toContain("too_many_attempts");
  });

  it("caps one address over many accounts at 30 failures, but not an account signing in from its own usual address", async () => {
    // A shared NAT: the analyst signs in from here every day; someone else sprays guesses from it.
    const sprayer = "203.0.113.77";
    expect(await new ApiClient(server.url).signIn(DEMO_EMAILS.analyst, DEMO_PASSWORD, from(sprayer))).not.toContain("error=");
    for (let i = 0; i < 30; i++) await new ApiClient(server.url).signIn(`someone-${i}@fjordlight.test`, "wrong-password", from(sprayer));
    const next = await new ApiClient(server.url).signIn("someone-else@fjordlight.test", "wrong-password", from(sprayer));
    expect(decodeURIComponent(next)).toContain("too_many_attempts");
    const analyst = new ApiClient(server.url);
    expect(await analyst.signIn(DEMO_EMAILS.analyst, DEMO_PASSWORD, from(sprayer))).not.toContain("error=");
    expect((await analyst.get("/api/me")).status).toBe(200);
  });
});

// Timing as an oracle (OWASP Authentication Cheat Sheet, "authentication responses" — common
// practice): an unknown e-mail must take about as long as a wrong password for a real account.
// Before the dummy-hash comparison the ratio here was about 0.1 (10 ms vs 99 ms).
describe("sign-in timing", () => {
  async function signInMs(email: string): Promise<number> {
    const c = new ApiClient(server.url);
    const t0 = performance.now();
    await c.signIn(email, "wrong-password");
    return performance.now() - t0;
  }
  it("does not reveal which e-mails have accounts", async () => {
    // Interleaved rounds, each order in turn, so a busy machine slows both sides of a ratio
    // alike; the median of the rounds' ratios.
    const ratios: number[] = [];
    for (let round = 0; round < 7; round++) {
      const first = round % 2 === 0;
      const a = await signInMs(first ? "nobody-here@fjordlight.test" : DEMO_EMAILS.analyst);
      const b = await signInMs(first ? DEMO_EMAILS.analyst : "nobody-here@fjordlight.test");
      ratios.push(first ? a / b : b / a);
    }
    expect(ratios.sort((x, y) => x - y)[3]).toBeGreaterThan(0.5);
  });
});
