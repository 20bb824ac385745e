import { beforeEach, describe, expect, it, vi } from "vitest";
import type { AnyShape } from "@/lib/markup/types";
import { ApiError } from "@/lib/client/api";
import { padShape, setup, TIME } from "./editor/editor-test-kit";
import { saveEntry } from "./persist-changes";

/**
 * A slow stand-in for the markup API, built by the test as the ground truth: it answers only
 * when told to, keeps the stored shapes, replaces properties whole on PATCH (as the real route
 * does) and refuses a PATCH whose version is not the stored one with a 409.
 */
type Pending = { method: string; path: string; body: unknown; answer: () => void };
const server = { shapes: new Map<string, AnyShape>(), pending: [] as Pending[] };

vi.mock("@/lib/client/api", async (load) => {
  const real = await load<typeof import("@/lib/client/api")>();
  const handle = (method: string, path: string, body: unknown): unknown => {
    if (method === "POST") {
      const out = (body as AnyShape[]).map((s) => ({ ...s, version: 1, createdBy: "analyst", updatedAt: TIME }) as AnyShape);
      for (const s of out) server.shapes.set(s.id, s);
      return out;
    }
    const id = path.split("/").pop()!;
    const stored = server.shapes.get(id)!;
    const patch = body as { version: number; geometry: AnyShape["geometry"]; properties: AnyShape["properties"] };
    if (patch.version !== stored.version) throw new real.ApiError(409, "Someone else changed this shape.");
    const next = { ...stored, geometry: patch.geometry, properties: patch.properties, version: stored.version + 1 } as AnyShape;
    server.shapes.set(id, next);
    return next;
  };
  return {
    ...real,
    apiFetch: (path: string, init: { method?: string; body?: unknown } = {}) =>
      new Promise((resolve, reject) => {
        const method = init.method ?? "GET";
        server.pending.push({
          method,
          path,
          body: init.body,
          answer: () => {
            try {
              resolve(handle(method, path, init.body));
            } catch (e) {
              reject(e);
            }
          },
        });
      }),
  };
});

/** Lets the save queue run until it waits on the server again. */
const settle = () => new Promise((r) => setTimeout(r, 0));

/** Answers the oldest request in flight and lets the queue send the next one. */
async function answerNext(): Promise<Pending> {
  await settle();
  const next = server.pending.shift();
  if (!next) throw new Error("no request in flight");
  next.answer();
  await settle();
  return next;
}

/** An editor whose commits go through saveEntry one after another, as in the markup workspace. */
function savingEditor(shapes: AnyShape[] = []) {
  const t = setup({ shapes });
  const versions = new Map(shapes.map((s) => [s.id, s.version]));
  const failures: unknown[] = [];
  let tail = Promise.resolve();
  t.editor.onCommit((entry) => {
    tail = tail.then(() => saveEntry(t.editor, "die-nv24r", entry, versions).catch((e) => void failures.push(e)));
  });
  return { ...t, failures, drained: async () => (await settle(), tail) };
}

async function answerAll() {
  while ((await settle(), server.pending.length > 0)) await answerNext();
}

beforeEach(() => {
  server.shapes.clear();
  server.pending.length = 0;
});

describe("saving edits made while earlier writes are in flight", () => {
  it("keeps a label typed before the new pad's create has answered", async () => {
    const t = savingEditor();
    t.editor.setTool("pad");
    t.drag([100, 140], [180, 200]);
    const id = t.ofKind("pad")[0].id;
    t.editor.updateProperties(id, { label: "VCC" });
    // The create answers (with the label it was sent, P1) before the net is typed.
    expect((await answerNext()).method).toBe("POST");
    expect(t.shape(id)?.properties.label).toBe("VCC");
    t.editor.updateProperties(id, { net: "VCC" });
    await answerAll();
    await t.drained();
    expect(t.failures).toEqual([]);
    expect(server.shapes.get(id)?.properties).toMatchObject({ label: "VCC", net: "VCC" });
    expect(t.shape(id)).toEqual(server.shapes.get(id));
    expect(t.shape(id)?.version).toBe(3);
  });

  it("does not roll a newer edit back when an earlier PATCH answers", async () => {
    const vdd = padShape("vdd", 60, 800, 80, { label: "P7" });
    server.shapes.set(vdd.id, vdd);
    const t = savingEditor([vdd]);
    t.editor.updateProperties("vdd", { label: "VDD" });
    t.editor.updateProperties("vdd", { net: "VDD" });
    expect((await answerNext()).method).toBe("PATCH");
    // The first answer knows only the label; the net typed after it must stay on screen.
    expect(t.shape("vdd")?.properties).toMatchObject({ label: "VDD", net: "VDD" });
    expect(t.shape("vdd")?.version).toBe(2);
    await answerAll();
    await t.drained();
    expect(server.shapes.get("vdd")?.properties).toMatchObject({ label: "VDD", net: "VDD" });
    expect(t.shape("vdd")).toEqual(server.shapes.get("vdd"));
  });

  it("still refuses a stale version with the server's 409", async () => {
    const vdd = padShape("vdd", 60, 800, 80, { label: "P7" });
    server.shapes.set(vdd.id, { ...vdd, version: 7 });
    const t = savingEditor([vdd]);
    t.editor.updateProperties("vdd", { label: "VDD" });
    await answerAll();
    await t.drained();
    expect(t.failures).toHaveLength(1);
    expect((t.failures[0] as ApiError).status).toBe(409);
    expect(server.shapes.get("vdd")?.properties.label).toBe("P7");
  });
});
