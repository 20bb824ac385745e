import { expect, test, type Browser, type Page } from "@playwright/test";
import { closeExtraContexts, signIn, signInAs } from "./helpers";

// The inbox, the invitation prompt for an existing user and the account page, in a real browser.
const SHOTS = "test-results/screens";

async function as(browser: Browser, who: "owner" | "analyst" | "reviewer" | "viewer") {
  const page = await (await browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
  await signInAs(page, who);
  return page;
}

/** A JSON API call made by the page itself (same origin, its own session cookie). */
async function api<T>(page: Page, method: string, path: string, body?: unknown): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const res = await fetch(path, {
        method,
        headers: body === undefined ? {} : { "content-type": "application/json" },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const text = await res.text();
      return { status: res.status, body: text ? JSON.parse(text) : null };
    },
    { method, path, body },
  );
}

async function demoTeamId(page: Page): Promise<string> {
  const me = await api<{ teams: { id: string; name: string }[] }>(page, "GET", "/api/me");
  return me.body.teams.find((t) => t.name === "Fjordlight Failure Lab")!.id;
}

test.describe.serial("inbox, invitations and account", () => {
  test.afterEach(closeExtraContexts);

  test("a mention reaches the analyst's inbox, counted in the top bar, and opens the exact remark", async ({ browser }) => {
    const reviewer = await as(browser, "reviewer");
    await reviewer.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await reviewer.getByRole("link", { name: "NV-24R die A" }).click();
    await expect(reviewer).toHaveURL(/\/dies\/[0-9a-f-]{36}$/);
    const dieId = new URL(reviewer.url()).pathname.split("/").pop()!;
    const region = {
      type: "Polygon",
      coordinates: [
        [
          [400, 400],
          [600, 400],
          [600, 600],
          [400, 600],
          [400, 400],
        ],
      ],
    };
    // A question of this run's own, so a repeated run finds exactly one inbox item for it.
    const asked = `is the guard ring here closed on the left side (${Date.now().toString(36)})?`;
    const thread = await api<{ id: string }>(reviewer, "POST", `/api/dies/${dieId}/threads`, { region, body: `@Demo Analyst ${asked}` });
    expect(thread.status).toBe(201);

    const analyst = await as(browser, "analyst");
    const unread = analyst.getByTestId("inbox-unread");
    await expect(unread).toBeVisible();
    const before = Number(await unread.innerText());
    expect(before).toBeGreaterThanOrEqual(1);
    await analyst.getByTestId("inbox-link").click();
    await expect(analyst.getByRole("heading", { name: "Inbox" })).toBeVisible();
    const item = analyst.getByTestId("inbox-item").filter({ hasText: asked });
    await expect(item).toHaveAttribute("data-unread", "true");
    await expect(item).toContainText("Demo Reviewer named you in a remark on NV-24R die A");
    await analyst.screenshot({ path: `${SHOTS}/inbox.png` });

    await item.getByRole("link").click();
    await expect(analyst).toHaveURL(new RegExp(`/dies/${dieId}\\?thread=${thread.body.id}$`));
    await expect(analyst.getByText(asked)).toBeVisible();
    await analyst.goto("/inbox");
    await expect(analyst.getByTestId("inbox-item").filter({ hasText: asked })).not.toHaveAttribute("data-unread", "true");
    if (before > 1) await expect(unread).toHaveText(String(before - 1));
    else await expect(unread).toBeHidden();
  });

  test("an existing user is asked about an invitation and joins only on accepting", async ({ browser }) => {
    const owner = await as(browser, "owner");
    const teamId = await demoTeamId(owner);
    expect((await api(owner, "POST", `/api/teams/${teamId}/invitations`, { email: "outsider@elsewhere.test", role: "viewer" })).status).toBe(201);

    // Whatever happens below, the outsider leaves the lab's team again: the other specs rely on
    // the outsider seeing none of the demo data.
    try {
      const outsider = await (await browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
      await signIn(outsider, "outsider@elsewhere.test");
      await expect(outsider.getByRole("heading", { name: "Cases" })).toBeVisible();
      const prompt = outsider.getByRole("region", { name: "Invitation to Fjordlight Failure Lab" });
      await expect(prompt).toContainText("Demo Owner invited you to join Fjordlight Failure Lab as viewer");
      const nav = outsider.getByRole("navigation", { name: "Main" });
      await expect(nav.getByRole("link", { name: "Fjordlight Failure Lab" })).toHaveCount(0);
      await outsider.screenshot({ path: `${SHOTS}/invitation-prompt.png` });

      await prompt.getByRole("button", { name: "Decline" }).click();
      await expect(prompt.getByRole("status")).toHaveText("You declined the invitation to Fjordlight Failure Lab.");
      await outsider.reload();
      await expect(outsider.getByRole("region", { name: "Invitation to Fjordlight Failure Lab" })).toHaveCount(0);
      await expect(nav.getByRole("link", { name: "Fjordlight Failure Lab" })).toHaveCount(0);

      expect((await api(owner, "POST", `/api/teams/${teamId}/invitations`, { email: "outsider@elsewhere.test", role: "viewer" })).status).toBe(201);
      await outsider.reload();
      await outsider.getByRole("button", { name: "Join Fjordlight Failure Lab" }).click();
      await expect(outsider.getByText("You joined Fjordlight Failure Lab.")).toBeVisible();
      await expect(nav.getByRole("link", { name: "Fjordlight Failure Lab" })).toBeVisible();
      // The confirmation stays until dismissed, though the refresh dropped the invitation.
      await outsider.getByRole("button", { name: "Dismiss" }).click();
      await expect(outsider.getByText("You joined Fjordlight Failure Lab.")).toBeHidden();
    } finally {
      const members = await api<{ userId: string; email: string }[]>(owner, "GET", `/api/teams/${teamId}/members`);
      const outsiderId = members.body.find((m) => m.email === "outsider@elsewhere.test")?.userId;
      if (outsiderId) expect((await api(owner, "DELETE", `/api/teams/${teamId}/members/${outsiderId}`)).status).toBe(204);
    }
  });

  test("the mailed invitation link asks a signed-in existing user too", async ({ browser }) => {
    const owner = await as(browser, "owner");
    const teamId = await demoTeamId(owner);
    expect((await api(owner, "POST", `/api/teams/${teamId}/invitations`, { email: "outsider@elsewhere.test", role: "reviewer" })).status).toBe(201);
    // The newest invitation mail to the outsider, from the local mailbox.
    const messages = owner
      .getByRole("list", { name: "Messages" })
      .getByRole("button")
      .filter({ hasText: /Invitation to join/ })
      .filter({ hasText: "outsider@elsewhere.test" });
    // Three per run of this file (two from the test before); a repeated run (--repeat-each) on
    // the same server finds the earlier runs' mails too.
    const expected = 3 * (test.info().repeatEachIndex + 1);
    await expect(async () => {
      await owner.goto("/mailbox");
      await expect(messages).toHaveCount(expected, { timeout: 1000 });
    }).toPass({ timeout: 30_000 });
    await messages.first().click();
    await expect(owner.getByRole("region", { name: "Message" })).toContainText("/invitations/");
    const text = await owner.getByRole("region", { name: "Message" }).innerText();
    const link = /(http:\/\/\S+\/invitations\/[A-Za-z0-9_-]+)/.exec(text)![1];

    const outsider = await (await browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
    await signIn(outsider, "outsider@elsewhere.test");
    await expect(outsider.getByRole("heading", { name: "Cases" })).toBeVisible();
    await outsider.goto(new URL(link).pathname);
    await expect(outsider.getByRole("heading", { name: "Join Fjordlight Failure Lab" })).toBeVisible();
    await expect(outsider.getByText("Demo Owner invited you as reviewer")).toBeVisible();
    const prompt = outsider.getByRole("region", { name: "Invitation to Fjordlight Failure Lab" });
    await outsider.screenshot({ path: `${SHOTS}/invitation-link.png` });
    await prompt.getByRole("button", { name: "Decline" }).click();
    await expect(prompt.getByRole("status")).toHaveText("You declined the invitation to Fjordlight Failure Lab.");
    await outsider.reload();
    await expect(outsider.getByText("This invitation was declined.")).toBeVisible();
  });

  test("the account page signs the user out everywhere", async ({ browser }) => {
    const laptop = await as(browser, "viewer");
    const desk = await as(browser, "viewer");
    await desk.getByTestId("signed-in-as").click();
    await expect(desk.getByRole("heading", { name: "Account" })).toBeVisible();
    await expect(desk.getByText("Fjordlight Failure Lab: viewer")).toBeVisible();
    await desk.screenshot({ path: `${SHOTS}/account.png`, fullPage: true });
    await desk.getByRole("button", { name: "Sign out everywhere" }).click();
    await expect(desk).toHaveURL(/\/sign-in\?ended=everywhere/);
    await expect(desk.getByText("You were signed out on every device.")).toBeVisible();
    await laptop.goto("/cases");
    await expect(laptop).toHaveURL(/\/sign-in/);
  });
});
