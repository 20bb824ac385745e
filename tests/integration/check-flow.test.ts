import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, EVERYONE, freshCase, type Who } from "./fixtures";
import type { ApiClient } from "../support/client";

// The check of a die over HTTP, every action × state × caller, against the table issue #15
// spells out (after engineering drawing checks, common practice): send (analyst or owner:
// draft/returned → with_checker), withdraw (the sender: with_checker → draft), sign_off and
// return (owner or reviewer, never the die's own analyst: with_checker → signed_off/returned).
// Roles and 404/401 from PRODUCT.md's role table. The expectations are written here, not
// read from the code.
type Status = "draft" | "with_checker" | "signed_off" | "returned";
const STATES: Status[] = ["draft", "with_checker", "signed_off", "returned"];
const ACTIONS = ["send", "withdraw", "sign_off", "return"] as const;
type Action = (typeof ACTIONS)[number];
const MOVES: Partial<Record<`${Action} ${Status}`, Status>> = {
  "send draft": "with_checker",
  "send returned": "with_checker",
  "withdraw with_checker": "draft",
  "sign_off with_checker": "signed_off",
  "return with_checker": "returned",
};
const DRAWERS = ["owner", "analyst"]; // the edit right
const CHECKERS = ["owner", "reviewer"]; // the decide right

/**
 * The answer for `who` doing `action` on a die in `state` that the demo analyst drew and (when
 * it was sent) sent: rights first (403), then the state (409), then "only the sender withdraws".
 */
function expected(who: Who, action: Action, state: Status): number {
  if (who === "anonymous") return 401;
  if (who === "outsider") return 404;
  const drawing = action === "send" || action === "withdraw";
  if (!(drawing ? DRAWERS : CHECKERS).includes(who)) return 403;
  if (!MOVES[`${action} ${state}`]) return 409;
  if (action === "withdraw" && who !== "analyst") return 403;
  return 200;
}

let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

const move = (c: ApiClient, dieId: string, action: string, message = "") =>
  c.request<{ reviewStatus: Status; error?: string }>("POST", `/api/dies/${dieId}/review`, { action, message });

/** A die drawn by the demo analyst, brought to `state` by the analyst (send) and the reviewer. */
async function dieIn(state: Status): Promise<string> {
  const { caseId } = await freshCase(world.clients.owner, world.teamId);
  const d = await world.clients.analyst.request<{ id: string }>("POST", `/api/cases/${caseId}/dies`, { name: "analyst's die", widthUm: 1000, heightUm: 800 });
  const dieId = d.body.id;
  if (state !== "draft") expect((await move(world.clients.analyst, dieId, "send")).status).toBe(200);
  if (state === "signed_off") expect((await move(world.clients.reviewer, dieId, "sign_off")).status).toBe(200);
  if (state === "returned") expect((await move(world.clients.reviewer, dieId, "return", "label VB2")).status).toBe(200);
  return dieId;
}

describe("POST /api/dies/{dieId}/review: every action × state × caller", () => {
  for (const state of STATES) {
    it(`answers as the table says on a die that is ${state}`, async () => {
      for (const action of ACTIONS) {
        for (const who of EVERYONE) {
          const dieId = await dieIn(state);
          const res = await move(world.clients[who], dieId, action, `by ${who}`);
          const want = expected(who, action, state);
          expect(res.status, `${who} ${action} on ${state}: ${JSON.stringify(res.body)}`).toBe(want);
          const after = (await world.clients.owner.get<{ reviewStatus: Status }>(`/api/dies/${dieId}`)).body.reviewStatus;
          expect(after, `${who} ${action} on ${state}`).toBe(want === 200 ? MOVES[`${action} ${state}`] : state);
        }
      }
    }, 240_000);
  }

  it("never lets the die's own analyst sign off or return it, even as an owner", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId); // the owner made it: its analyst
    expect((await move(world.clients.owner, dieId, "send")).status).toBe(200);
    for (const action of ["sign_off", "return"]) {
      const res = await move(world.clients.owner, dieId, action);
      expect(res.status).toBe(403);
      expect(res.body.error).toMatch(/analyst/);
    }
    expect((await world.clients.owner.get<{ reviewStatus: Status }>(`/api/dies/${dieId}`)).body.reviewStatus).toBe("with_checker");
  });

  it("refuses the old action names and unknown ones with 400, changing nothing", async () => {
    const dieId = await dieIn("with_checker");
    for (const action of ["submit", "approve", "request_changes", "publish"]) {
      const res = await move(world.clients.reviewer, dieId, action);
      expect(res.status, action).toBe(400);
      expect(res.body.error).toMatch(/action/);
    }
    expect((await world.clients.owner.get<{ reviewStatus: Status }>(`/api/dies/${dieId}`)).body.reviewStatus).toBe("with_checker");
  });

  it("keeps the history through draft → with checker → returned → with checker → signed off", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    expect((await move(world.clients.reviewer, dieId, "sign_off")).status).toBe(409);
    expect((await move(world.clients.owner, dieId, "send", "first pass")).body.reviewStatus).toBe("with_checker");
    expect((await move(world.clients.reviewer, dieId, "return", "label VB2")).body.reviewStatus).toBe("returned");
    expect((await move(world.clients.owner, dieId, "send", "labelled")).body.reviewStatus).toBe("with_checker");
    expect((await move(world.clients.reviewer, dieId, "sign_off", "ok")).body.reviewStatus).toBe("signed_off");
    const history = (await world.clients.viewer.get<{ action: string; message: string; revision: number }[]>(`/api/dies/${dieId}/review`)).body;
    expect(history.map((h) => h.action)).toEqual(["sign_off", "send", "return", "send"]);
    expect(history[2].message).toBe("label VB2");
    expect(history.every((h) => h.revision === 1)).toBe(true);
  });
});
