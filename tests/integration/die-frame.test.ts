import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld } from "./fixtures";

// A die outline defines the die frame: its lower-left corner becomes the origin and its sides
// the die's size; every shape moves with it so nothing moves against the image.
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

const rect = (x0: number, y0: number, x1: number, y1: number) => ({
  type: "Polygon",
  coordinates: [
    [
      [x0, y0],
      [x1, y0],
      [x1, y1],
      [x0, y1],
      [x0, y0],
    ],
  ],
});

describe("die outline", () => {
  it("moves the origin to its lower-left corner and sets the die size", async () => {
    const owner = world.clients.owner;
    const c = await owner.request<{ id: string }>("POST", `/api/teams/${world.teamId}/cases`, { title: "Frame case" });
    const d = await owner.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "unsized die" });
    const pad = await owner.request<{ id: string }>("POST", `/api/dies/${d.body.id}/markup`, {
      kind: "pad",
      geometry: rect(500, 500, 580, 580),
      properties: { label: "A", net: "", state: "bonded" },
    });
    expect(pad.status).toBe(201);
    const outline = await owner.request<{ geometry: { coordinates: number[][][] }; version: number }>("POST", `/api/dies/${d.body.id}/markup`, {
      kind: "die_outline",
      geometry: rect(300, 250, 2700, 1850),
      properties: {},
    });
    expect(outline.status).toBe(201);
    // Worked by hand: offset (300, 250); the outline becomes (0,0)–(2400,1600).
    expect(outline.body.geometry.coordinates[0][0]).toEqual([0, 0]);
    const die = await owner.get<{ widthUm: number; heightUm: number }>(`/api/dies/${d.body.id}`);
    expect(die.body).toMatchObject({ widthUm: 2400, heightUm: 1600 });
    const shapes = await owner.get<{ id: string; geometry: { coordinates: number[][][] }; version: number }[]>(`/api/dies/${d.body.id}/markup`);
    const moved = shapes.body.find((s) => s.id === pad.body.id)!;
    expect(moved.geometry.coordinates[0][0]).toEqual([200, 250]);
    expect(moved.version).toBe(2);
    // Drawing the same outline again changes nothing more.
    const again = await owner.request("POST", `/api/dies/${d.body.id}/markup`, { kind: "die_outline", geometry: rect(0, 0, 2400, 1600), properties: {} });
    expect(again.status).toBe(201);
    const after = await owner.get<{ id: string; version: number }[]>(`/api/dies/${d.body.id}/markup`);
    expect(after.body.find((s) => s.id === pad.body.id)!.version).toBe(2);
  });

  it("refuses an outline that is not a rectangle and writes nothing", async () => {
    const owner = world.clients.owner;
    const c = await owner.request<{ id: string }>("POST", `/api/teams/${world.teamId}/cases`, { title: "Frame case 2" });
    const d = await owner.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "die" });
    const res = await owner.request<{ error: string }>("POST", `/api/dies/${d.body.id}/markup`, {
      kind: "die_outline",
      geometry: {
        type: "Polygon",
        coordinates: [
          [
            [0, 0],
            [100, 0],
            [120, 90],
            [0, 100],
            [0, 0],
          ],
        ],
      },
      properties: {},
    });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/rectangle/);
    expect((await owner.get<unknown[]>(`/api/dies/${d.body.id}/markup`)).body).toEqual([]);
  });

  it("undoes a re-framing: origin, size and the earlier outline come back through the restore path", async () => {
    const owner = world.clients.owner;
    const c = await owner.request<{ id: string }>("POST", `/api/teams/${world.teamId}/cases`, { title: "Frame undo case" });
    const d = await owner.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "NV-24R", widthUm: 2400, heightUm: 1600 });
    const dieId = d.body.id;
    const earlier = await owner.request<{ id: string }>("POST", `/api/dies/${dieId}/markup`, {
      kind: "die_outline",
      geometry: rect(0, 0, 2400, 1600),
      properties: {},
    });
    const pad = await owner.request<{ id: string }>("POST", `/api/dies/${dieId}/markup`, {
      kind: "pad",
      geometry: rect(500, 500, 580, 580),
      properties: { label: "VCC", net: "", state: "unbonded" },
    });
    // The fault seen: an outline drawn a few µm inside the edge re-framed the die for good.
    await owner.request("POST", `/api/dies/${dieId}/markup`, { kind: "die_outline", geometry: rect(3, 4, 2397, 1597), properties: {} });
    await owner.request("DELETE", `/api/markup/${earlier.body.id}`);
    const framed = await owner.get<{ widthUm: number; heightUm: number }>(`/api/dies/${dieId}`);
    // Worked by hand: 2397 − 3 = 2394, 1597 − 4 = 1593; the pad moved by (−3, −4).
    expect(framed.body).toMatchObject({ widthUm: 2394, heightUm: 1593 });
    const restore = await owner.request<{ moved: number }>("POST", `/api/dies/${dieId}/frame/restore`, {
      originUm: [-3, -4],
      widthUm: 2400,
      heightUm: 1600,
      outline: rect(0, 0, 2400, 1600),
    });
    expect(restore.status).toBe(200);
    const die = await owner.get<{ widthUm: number; heightUm: number }>(`/api/dies/${dieId}`);
    expect(die.body).toMatchObject({ widthUm: 2400, heightUm: 1600 });
    const shapes = (await owner.get<{ id: string; kind: string; geometry: { coordinates: number[][][] } }[]>(`/api/dies/${dieId}/markup`)).body;
    expect(shapes.find((s) => s.id === pad.body.id)!.geometry.coordinates[0][0]).toEqual([500, 500]);
    const outlines = shapes.filter((s) => s.kind === "die_outline");
    expect(outlines.map((o) => o.geometry.coordinates[0])).toEqual([rect(0, 0, 2400, 1600).coordinates[0]]);
  });

  it("restores a frame that had no outline, and refuses bad input and readers without changing anything", async () => {
    const owner = world.clients.owner;
    const c = await owner.request<{ id: string }>("POST", `/api/teams/${world.teamId}/cases`, { title: "Frame undo case 2" });
    const d = await owner.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "die", widthUm: 2400, heightUm: 1600 });
    const dieId = d.body.id;
    const pad = await owner.request<{ id: string }>("POST", `/api/dies/${dieId}/markup`, {
      kind: "pad",
      geometry: rect(500, 500, 580, 580),
      properties: { label: "A", net: "", state: "unbonded" },
    });
    await owner.request("POST", `/api/dies/${dieId}/markup`, { kind: "die_outline", geometry: rect(10, 20, 2390, 1580), properties: {} });
    const bad = await owner.request<{ error: string }>("POST", `/api/dies/${dieId}/frame/restore`, {
      originUm: [-10, -20],
      widthUm: 2400,
      heightUm: 1600,
      outline: {
        type: "Polygon",
        coordinates: [
          [
            [0, 0],
            [100, 0],
            [120, 90],
            [0, 100],
            [0, 0],
          ],
        ],
      },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatch(/rectangle/);
    const viewer = await world.clients.viewer.request("POST", `/api/dies/${dieId}/frame/restore`, {
      originUm: [-10, -20],
      widthUm: 2400,
      heightUm: 1600,
      outline: null,
    });
    expect(viewer.status).toBe(403);
    expect((await owner.get<{ widthUm: number }>(`/api/dies/${dieId}`)).body.widthUm).toBe(2380);
    const ok = await owner.request("POST", `/api/dies/${dieId}/frame/restore`, { originUm: [-10, -20], widthUm: 2400, heightUm: 1600, outline: null });
    expect(ok.status).toBe(200);
    const shapes = (await owner.get<{ id: string; kind: string; geometry: { coordinates: number[][][] } }[]>(`/api/dies/${dieId}/markup`)).body;
    expect(shapes.map((s) => s.kind)).toEqual(["pad"]);
    expect(shapes[0].geometry.coordinates[0][0]).toEqual([500, 500]);
    expect((await owner.get<{ widthUm: number; heightUm: number }>(`/api/dies/${dieId}`)).body).toMatchObject({ widthUm: 2400, heightUm: 1600 });
    void pad;
  });
});
