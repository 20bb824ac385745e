"use client";

import { useEffect } from "react";
import type OpenSeadragon from "openseadragon";
import type { Affine2x3 } from "@/lib/geometry/types";
import { followerView } from "@/lib/alignment/view-lock";
import type { ViewerApi } from "@/components/viewer";

type Side = { api: ViewerApi | null; imageToDie: Affine2x3 | null };

/**
 * Sets `follower` so that it shows the die exactly as `leader` does: same die point under
 * the centre, same µm per screen px, same die-frame rotation. All changes are immediate, so the
 * follower is never a spring step behind.
 */
function applyLock(leader: ViewerApi, leaderT: Affine2x3, follower: ViewerApi, followerT: Affine2x3): void {
  const vp: OpenSeadragon.Viewport = follower.viewer.viewport;
  const size = leader.viewer.viewport.getContainerSize();
  const centre = { x: size.x / 2, y: size.y / 2 };
  const p = leader.screenToImage(centre.x, centre.y);
  if (!Number.isFinite(p.x)) return;
  const want = followerView(leaderT, followerT, {
    imagePoint: [p.x, p.y],
    imageZoom: leader.imageZoom(),
    rotationDeg: leader.viewer.viewport.getRotation(true),
  });
  vp.setRotation(want.rotationDeg, true);
  const now = follower.imageZoom();
  // No reference point: zoomTo then keeps the viewport centre, which is re-set just below.
  if (now > 0 && Number.isFinite(now)) vp.zoomTo(vp.getZoom(true) * (want.imageZoom / now), undefined, true);
  // The wanted image point goes to the follower's centre (its size may differ from the leader's).
  follower.centreOnImagePoint(want.imagePoint[0], want.imagePoint[1]);
  follower.viewer.forceRedraw();
}

/**
 * Locks two viewers in die coordinates. The viewer the user last touched (pointer, wheel or
 * key) leads and the other follows; a follower's own view events are ignored, and a guard
 * stops the update we make from coming back, so the two never ping-pong.
 */
export function useViewLock(a: Side, b: Side, enabled = true): void {
  useEffect(() => {
    const { api: apiA, imageToDie: tA } = a;
    const { api: apiB, imageToDie: tB } = b;
    if (!enabled || !apiA || !apiB || !tA || !tB) return;
    let leader: "a" | "b" = "a";
    let applying = false;
    const follow = (from: "a" | "b") => () => {
      if (applying || from !== leader) return;
      applying = true;
      try {
        if (from === "a") applyLock(apiA, tA, apiB, tB);
        else applyLock(apiB, tB, apiA, tA);
      } finally {
        applying = false;
      }
    };
    const offA = apiA.onViewChange(follow("a"));
    const offB = apiB.onViewChange(follow("b"));
    const take = (side: "a" | "b") => () => {
      leader = side;
    };
    const events = ["pointerdown", "wheel", "keydown"] as const;
    const elA = apiA.viewer.element;
    const elB = apiB.viewer.element;
    const takeA = take("a");
    const takeB = take("b");
    for (const e of events) {
      elA.addEventListener(e, takeA, { capture: true });
      elB.addEventListener(e, takeB, { capture: true });
    }
    follow("a")();
    return () => {
      offA();
      offB();
      for (const e of events) {
        elA.removeEventListener(e, takeA, { capture: true });
        elB.removeEventListener(e, takeB, { capture: true });
      }
    };
  }, [a.api, a.imageToDie, b.api, b.imageToDie, enabled]); // eslint-disable-line react-hooks/exhaustive-deps
}
