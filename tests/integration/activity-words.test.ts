import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import { padPairs, uploadDemoMicrograph } from "../support/demo-micrographs";
import { activitySentence } from "@/lib/review/activity-words";

// The activity list in sentences, from the audit rows plus what the server looks up beside them
// (the micrograph an alignment moved, the remark a reply belongs to).
type Item = { action: string; detail: string; actorName: string | null };
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;

const square = (x: number, y: number, s: number) => ({
  type: "Polygon",
  coordinates: [
    [
      [x, y],
      [x + s, y],
      [x + s, y + s],
      [x, y + s],
      [x, y],
    ],
  ],
});

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Activity wording"));
  const bright = await uploadDemoMicrograph(world.clients.analyst, dieId, "bright_field", 1200);
  const dark = await uploadDemoMicrograph(world.clients.analyst, dieId, "dark_field", 1200);
  const put = (id: string, pairs: unknown) => world.clients.analyst.request("PUT", `/api/micrographs/${id}/alignment`, { model: "similarity", pairs });
  expect((await put(bright.id, padPairs(bright.render))).status).toBe(200);
  expect((await put(dark.id, padPairs(dark.render, ["G1", "G6", "VCC2", "VEE1"]))).status).toBe(200);
  const remark = await world.clients.reviewer.request<{ id: string }>("POST", `/api/dies/${dieId}/threads`, {
    region: square(400, 400, 60),
    body: "Is the seal ring closed here?",
  });
  expect(remark.status).toBe(201);
  expect((await world.clients.analyst.request("POST", `/api/threads/${remark.body.id}/comments`, { body: "Yes, on both sides." })).status).toBe(201);
  expect((await world.clients.reviewer.request("POST", `/api/threads/${remark.body.id}/resolve`, {})).status).toBe(200);
}, 180_000);

describe("die activity in words", () => {
  it("names the aligned micrograph with its illumination, and numbers the remark its reply and closing refer to", async () => {
    const res = await world.clients.viewer.get<{ items: Item[] }>(`/api/dies/${dieId}/activity?limit=50`);
    expect(res.status).toBe(200);
    const lines = res.body.items.map((i) => `${i.actorName} ${activitySentence(i.action, i.detail)}`);
    expect(lines).toEqual(
      expect.arrayContaining([
        "Demo Analyst aligned the dark-field micrograph “NV-24R dark field” to the die frame (similarity, 4 control points)",
        "Demo Analyst uploaded the bright-field micrograph “NV-24R bright field”",
        "Demo Reviewer raised remark 1",
        "Demo Reviewer wrote remark 1: “Is the seal ring closed here?”",
        "Demo Analyst wrote a reply on remark 1: “Yes, on both sides.”",
        "Demo Reviewer closed remark 1",
      ]),
    );
    // No entry shows an audit code as it is stored.
    for (const l of lines) expect(l).not.toMatch(/\b[a-z]+\.[a-z_]+\b/);
  });
});
