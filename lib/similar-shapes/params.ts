import type { PxBoxDto } from "@/lib/dto/find-similar";

/** A search request as stored on its row once resolved: everything the job needs, nothing it must look up again. */
export type ImageSearchParams = {
  /** The template in full-resolution image px. */
  template: PxBoxDto;
  /** The shape the template came from, when it was one (excluded from the answer like the template box). */
  shapeId: string | null;
  kind: "pad" | "block";
  /** The template shape's size in die µm (width, height), so added shapes match it exactly. */
  sizeUm: [number, number] | null;
  minScore: number;
  rotations: (0 | 90 | 180 | 270)[];
  mirrored: boolean;
  region: PxBoxDto | null;
};
