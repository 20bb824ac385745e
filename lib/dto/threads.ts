// Shapes of what the API answers; the server builds them, client components read them.
import type { Geometry } from "@/lib/geometry/types";
import type { ThreadStatus } from "@/lib/dto/stored-values";

export type CommentDto = {
  id: string;
  threadId: string;
  authorId: string | null;
  authorName: string | null;
  body: string;
  mentions: string[];
  editedAt: string | null;
  createdAt: string;
};

export type ThreadDto = {
  id: string;
  dieId: string;
  shapeId: string | null;
  /** Where the thread sits in die µm: the region, or the shape's geometry when it was started. */
  anchor: Geometry;
  /** The centre of the anchor, where its pin is drawn. */
  pin: [number, number];
  /** The thread was on a shape that has since been deleted. */
  orphaned: boolean;
  status: ThreadStatus;
  resolvedBy: { id: string; name: string } | null;
  resolvedAt: string | null;
  createdBy: string | null;
  createdByName: string | null;
  createdAt: string;
  comments: CommentDto[];
};
