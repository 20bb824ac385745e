import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, EVERYONE, expectedStatus, freshCase } from "./fixtures";
import { makeJpeg, uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";

// Rename, reorder and change the reference of a die's micrographs. Transforms are compared
// with the stored values before the change: re-choosing the reference must move nothing.
type M = { id: string; label: string; position: number; isReference: boolean; transform: number[][] | null };
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
const ids: string[] = [];

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Management target"));
  const jpeg = await makeJpeg(400, 300);
  for (const label of ["first", "second", "third"]) {
    const res = await world.clients.analyst.upload<{ id: string }>(
      `/api/dies/${dieId}/micrographs`,
      uploadForm(jpeg, `${label}.jpg`, { label, scaleUmPerPx: "0.5" }),
    );
    ids.push(res.body.id);
  }
  for (const id of ids) await waitForStatus(world.clients.analyst, id, "ready");
  // Put "second" in the die frame: the first micrograph's frame shifted 10 µm right (worked by hand).
  const pairs = [
    [0, 0],
    [400, 0],
    [400, 300],
    [0, 300],
  ].map(([x, y]) => ({ imagePx: [x, y], dieUm: [0.5 * x + 10, 150 - 0.5 * y] }));
  const aligned = await world.clients.analyst.request("PUT", `/api/micrographs/${ids[1]}/alignment`, { model: "similarity", pairs });
  if (aligned.status !== 200) throw new Error(JSON.stringify(aligned.body));
}, 60_000);

const list = async () => (await world.clients.viewer.get<M[]>(`/api/dies/${dieId}/micrographs`)).body;

describe("changing the reference micrograph", () => {
  it("refuses a micrograph that is not in the die frame", async () => {
    const res = await world.clients.analyst.request<{ error: string }>("PUT", `/api/micrographs/${ids[2]}/reference`);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/Align this micrograph/);
    expect((await list()).find((m) => m.isReference)?.id).toBe(ids[0]);
  });

  it("moves the reference flag and leaves every transform as it was", async () => {
    const before = await list();
    const res = await world.clients.analyst.request<M>("PUT", `/api/micrographs/${ids[1]}/reference`);
    expect(res.status).toBe(200);
    expect(res.body.isReference).toBe(true);
    const after = await list();
    expect(after.filter((m) => m.isReference).map((m) => m.id)).toEqual([ids[1]]);
    for (const m of after) expect(m.transform).toEqual(before.find((b) => b.id === m.id)!.transform);
    expect(after.find((m) => m.id === ids[1])!.transform).toEqual([
      [0.5, 0, 10],
      [0, -0.5, 150],
    ]);
  });

  it("follows the role table", async () => {
    for (const who of EVERYONE) {
      const res = await world.clients[who].request("PUT", `/api/micrographs/${ids[0]}/reference`);
      expect(res.status, who).toBe(expectedStatus(who, "edit", 200));
    }
  });
});

describe("reordering micrographs", () => {
  it("stores the new order", async () => {
    const order = [ids[2], ids[0], ids[1]];
    const res = await world.clients.analyst.request<M[]>("PUT", `/api/dies/${dieId}/micrographs/order`, { ids: order });
    expect(res.status).toBe(200);
    expect(res.body.map((m) => m.id)).toEqual(order);
    expect((await list()).map((m) => [m.id, m.position])).toEqual(order.map((id, i) => [id, i]));
  });

  it("refuses a list that misses, repeats or invents a micrograph, changing nothing", async () => {
    const before = await list();
    for (const bad of [[ids[0], ids[1]], [ids[0], ids[0], ids[1]], [ids[0], ids[1], "00000000-0000-4000-8000-000000000000"], ["not-a-uuid"]]) {
      const res = await world.clients.analyst.request<{ error: string }>("PUT", `/api/dies/${dieId}/micrographs/order`, { ids: bad });
      expect(res.status, JSON.stringify(bad)).toBe(400);
      expect(res.body.error.length).toBeGreaterThan(0);
    }
    expect(await list()).toEqual(before);
  });

  it("follows the role table", async () => {
    const order = (await list()).map((m) => m.id);
    for (const who of EVERYONE) {
      const res = await world.clients[who].request("PUT", `/api/dies/${dieId}/micrographs/order`, { ids: order });
      expect(res.status, who).toBe(expectedStatus(who, "edit", 200));
    }
  });
});

describe("renaming", () => {
  it("renames through PATCH and refuses an empty label", async () => {
    expect((await world.clients.analyst.request<M>("PATCH", `/api/micrographs/${ids[2]}`, { label: "dark field 10x" })).body.label).toBe("dark field 10x");
    expect((await world.clients.analyst.request("PATCH", `/api/micrographs/${ids[2]}`, { label: "  " })).status).toBe(400);
  });
});
