import { applyAffine, composeAffine, invertAffine, meanScale } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";

/** How a follower viewer must be set so it shows the die exactly as the leader does. */
export type FollowerView = {
  /** Follower image px to put at the point of the screen given. */
  readonly imagePoint: readonly [number, number];
  /** Screen px per follower image px. */
  readonly imageZoom: number;
  /** Follower rotation, degrees clockwise on screen (image axes are y-down). */
  readonly rotationDeg: number;
};

/**
 * Locks two views in die coordinates: die → screen must be the same map for both, so follower
 * image → screen = leader image → screen ∘ leaderToDie⁻¹ ∘ followerToDie. Given the leader's
 * image point under a screen point, its zoom and rotation, this returns the follower's. Exact
 * for similarity transforms of equal handedness (an affine's shear cannot be shown by a
 * rotate-and-zoom view; the mean scale and the x-axis direction are used then).
 */
export function followerView(
  leaderToDie: Affine2x3,
  followerToDie: Affine2x3,
  leader: { imagePoint: readonly [number, number]; imageZoom: number; rotationDeg: number },
): FollowerView {
  const [u, v] = applyAffine(leaderToDie, leader.imagePoint[0], leader.imagePoint[1]);
  const imagePoint = applyAffine(invertAffine(followerToDie), u, v);
  // follower px → leader px: its scale multiplies the zoom, its angle adds to the rotation.
  const m = composeAffine(invertAffine(leaderToDie), followerToDie);
  const angle = (Math.atan2(m[1][0], m[0][0]) * 180) / Math.PI;
  return { imagePoint, imageZoom: leader.imageZoom * meanScale(m), rotationDeg: leader.rotationDeg + angle };
}
