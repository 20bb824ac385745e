import { describe, it, expect } from "vitest";
import { paramsWithSession, paramsWithWorkMode, sessionFromParams, workModeFromParams } from "./work-mode-url";

const A = "0b7a3c1e-2f4d-4e6a-9b8c-1d2e3f4a5b6c";
const B = "9f8e7d6c-5b4a-4392-8170-6f5e4d3c2b1a";

describe("work mode in the URL", () => {
  it("writes and reads back an alignment and a comparison, keeping other params", () => {
    const base = new URLSearchParams("thread=t1");
    const align = paramsWithWorkMode(base, { kind: "align", movingId: A, fixedId: B });
    expect(align.get("thread")).toBe("t1");
    expect(workModeFromParams(align)).toEqual({ kind: "align", movingId: A, fixedId: B });
    const compare = paramsWithWorkMode(align, { kind: "compare", topId: B, bottomId: A, mode: "split" });
    expect(workModeFromParams(compare)).toEqual({ kind: "compare", topId: B, bottomId: A, mode: "split" });
    expect(compare.has("moving")).toBe(false);
    expect(paramsWithWorkMode(compare, { kind: "view" }).toString()).toBe("thread=t1");
  });

  it("reads the former mode names of older links as the renamed modes", () => {
    expect(workModeFromParams(new URLSearchParams(`work=compare&top=${A}&bottom=${B}&mode=blend`))).toMatchObject({ mode: "overlay" });
    expect(workModeFromParams(new URLSearchParams(`work=compare&top=${A}&bottom=${B}&mode=swipe`))).toMatchObject({ mode: "split" });
  });

  it("reads malformed params as the single view", () => {
    for (const q of ["work=align&moving=x&fixed=y", `work=compare&top=${A}&bottom=${B}&mode=flicker`, "work=other", ""]) {
      expect(workModeFromParams(new URLSearchParams(q)), q).toEqual({ kind: "view" });
    }
  });

  it("keeps an alignment session's pairs, pending point, model and mirrored flag", () => {
    const s = {
      pairs: [{ imagePx: [10.123, 20] as [number, number], fixedPx: [30, 40.5] as [number, number] }],
      pending: [5, 6] as [number, number],
      model: "affine" as const,
      mirrored: true,
    };
    const p = paramsWithSession(paramsWithWorkMode(new URLSearchParams(), { kind: "align", movingId: A, fixedId: B }), s);
    expect(sessionFromParams(new URLSearchParams(p.toString()))).toEqual({ ...s, pairs: [{ imagePx: [10.12, 20], fixedPx: [30, 40.5] }] });
    expect(sessionFromParams(paramsWithSession(p, { pairs: [], pending: null, model: null, mirrored: false }))).toEqual({
      pairs: [],
      pending: null,
      model: null,
      mirrored: false,
    });
  });

  it("ignores a session that is absent or malformed", () => {
    expect(sessionFromParams(new URLSearchParams("work=align"))).toBeNull();
    expect(sessionFromParams(new URLSearchParams("pairs=1,2,3"))).toBeNull();
    expect(sessionFromParams(new URLSearchParams("pairs=1,2,3,x"))).toBeNull();
  });
});
