"use client";

import { useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import { can } from "@/lib/auth/permissions";
import { boundingBox } from "@/lib/geometry/measure";
import { viewBoxUm } from "@/lib/geometry/view-box";
import { Button } from "@/components/ui/button";
import type { DieDto } from "@/lib/dto/dies";
import type { MemberDto } from "@/lib/dto/teams";
import type { ViewerApi } from "@/components/viewer";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { EditorState } from "@/components/annotate/editor/types";
import { ReplyBox } from "./reply-box";
import { ThreadView } from "./thread-view";
import { ReviewStatusPanel } from "./review-status-panel";
import { ActivityList } from "./activity-list";
import type { ReviewBench } from "./use-review-bench";

// Filter ids are code; "resolved" is the stored status of a closed remark.
type Filter = "all" | "open" | "resolved" | "mine" | "mentions";
const FILTERS: { id: Filter; label: string }[] = [
  { id: "all", label: "All" },
  { id: "open", label: "Open" },
  { id: "resolved", label: "Closed" },
  { id: "mine", label: "Raised by me" },
  { id: "mentions", label: "Naming me" },
];

const replies = (n: number) => `${n} ${n === 1 ? "reply" : "replies"}`;

const boxPolygon = (b: { minX: number; minY: number; maxX: number; maxY: number }) => ({
  type: "Polygon",
  coordinates: [
    [
      [b.minX, b.minY],
      [b.maxX, b.minY],
      [b.maxX, b.maxY],
      [b.minX, b.maxY],
      [b.minX, b.minY],
    ],
  ],
});

/** The Remarks tab: the die's check status, its remarks with filters, one remark, raising remarks, activity. */
export function ReviewPanel({
  die,
  userId,
  review,
  state,
  api,
  transform,
}: {
  die: DieDto;
  userId: string;
  review: ReviewBench;
  state: EditorState | null;
  api: ViewerApi | null;
  transform: Affine2x3 | null;
}) {
  const [filter, setFilter] = useState<Filter>("all");
  const [starting, setStarting] = useState<null | "shape" | "region">(null);
  const members = useQuery({ queryKey: queryKeys.members(die.teamId), queryFn: () => apiFetch<MemberDto[]>(`/api/teams/${die.teamId}/members`) }).data ?? [];
  const canComment = can(die.yourRole, "comment");
  const selection = [...(state?.selection ?? [])];
  const list = review.list;
  const shown = useMemo(
    () =>
      list.filter((t) => {
        if (filter === "open" || filter === "resolved") return t.status === filter;
        if (filter === "mine") return t.createdBy === userId;
        if (filter === "mentions") return t.comments.some((c) => c.mentions.includes(userId));
        return true;
      }),
    [list, filter, userId],
  );
  const openCount = list.filter((t) => t.status === "open").length;
  const selected = list.find((t) => t.id === review.selectedId);
  if (selected) {
    return (
      <ThreadView
        thread={selected}
        number={list.indexOf(selected) + 1}
        members={members}
        userId={userId}
        canComment={canComment}
        api={review.threads}
        onBack={() => review.select(null)}
      />
    );
  }

  const regionBox = () => {
    const shapes = selection.map((id) => state?.shapes.get(id)).filter((s) => !!s);
    if (shapes.length) {
      const boxes = shapes.map((s) => boundingBox(s!.geometry));
      return {
        minX: Math.min(...boxes.map((b) => b.minX)),
        minY: Math.min(...boxes.map((b) => b.minY)),
        maxX: Math.max(...boxes.map((b) => b.maxX)),
        maxY: Math.max(...boxes.map((b) => b.maxY)),
      };
    }
    if (!api || !transform) return null;
    const el = api.viewer.element;
    return viewBoxUm({ width: el.clientWidth, height: el.clientHeight }, api.screenToImage, transform);
  };

  const raiseRemark = async (body: string) => {
    if (starting === "shape") {
      const t = await review.threads.start.mutateAsync({ shapeId: selection[0], body });
      review.select(t.id);
    } else {
      const b = regionBox();
      if (!b) throw new Error("Open a micrograph in the die frame first.");
      const t = await review.threads.start.mutateAsync({ region: boxPolygon(b), body });
      review.select(t.id);
    }
    setStarting(null);
  };

  return (
    <div className="flex flex-col gap-5">
      <ReviewStatusPanel die={die} userId={userId} />
      <section aria-label="Remarks" className="flex flex-col gap-2">
        <h2 className="text-sm font-semibold">
          Remarks <span className="font-normal text-ink-400">{list.length ? `${openCount} open of ${list.length}` : ""}</span>
        </h2>
        {canComment && !starting && (
          <div className="flex flex-wrap gap-2">
            <Button disabled={selection.length !== 1} onClick={() => setStarting("shape")} title="Select one shape first">
              Raise remark on selection
            </Button>
            <Button onClick={() => setStarting("region")}>Raise remark on a region</Button>
          </div>
        )}
        {starting && (
          <ReplyBox
            members={members}
            label={starting === "shape" ? "Remark on the selected shape" : selection.length ? "Remark on the selection's area" : "Remark on the area in view"}
            submitLabel="Raise remark"
            onSubmit={raiseRemark}
            onCancel={() => setStarting(null)}
          />
        )}
        <div role="group" aria-label="Filter remarks" className="flex flex-wrap gap-1">
          {FILTERS.map((f) => (
            <button
              key={f.id}
              aria-pressed={filter === f.id}
              onClick={() => setFilter(f.id)}
              className={`rounded px-2 py-0.5 text-xs ${filter === f.id ? "bg-kerf-600/40 text-ink-100" : "bg-ink-800 text-ink-300"}`}
            >
              {f.label}
            </button>
          ))}
        </div>
        {review.threads.threads.isPending ? (
          <p className="text-sm text-ink-400">Loading remarks…</p>
        ) : shown.length === 0 ? (
          <p className="text-sm text-ink-400">{list.length === 0 ? "No remarks on this die yet." : "No remarks match this filter."}</p>
        ) : (
          <ul className="flex flex-col gap-1">
            {shown.map((t) => (
              <li key={t.id}>
                <button onClick={() => review.select(t.id)} className="w-full rounded-md border border-ink-800 p-2 text-left hover:bg-ink-800">
                  <span className="text-xs text-ink-400">
                    #{list.indexOf(t) + 1} · {t.status === "open" ? "open" : "closed"} · {replies(Math.max(0, t.comments.length - 1))}
                    {t.orphaned && " · shape deleted"}
                  </span>
                  <span className="block truncate text-sm text-ink-100">{t.comments[0]?.body ?? "(text deleted)"}</span>
                </button>
              </li>
            ))}
          </ul>
        )}
      </section>
      <ActivityList dieId={die.id} />
    </div>
  );
}
