/**
 * Symmetry report: every pad, block and trace paired with its mirror partner across the axis
 * (optimal assignment of centre distances, same kind only), with the offset and size
 * difference of each pair and the shapes left without a partner.
 */
import type { Geometry } from "../geometry/types";
import { aloneChoice, assignPairs } from "./assignment";
import { axisLine, mirrorGeometry, reflectPoint, signedDistance, type AxisLine } from "./reflect";
import { boundingBox, pathLength, shapeCentre } from "./shape-metrics";
import {
  SYMMETRY_KINDS,
  SymmetryInputError,
  type SizeDifference,
  type SymmetryAxis,
  type SymmetryKind,
  type SymmetryOptions,
  type SymmetryPair,
  type SymmetryReport,
  type SymmetryShape,
  type UnmatchedShape,
} from "./types";

type Prepared = { id: string; kind: SymmetryKind; geometry: Geometry; centre: [number, number]; mirrored: [number, number] };

function resolveOptions(options: SymmetryOptions): Required<SymmetryOptions> {
  const toleranceUm = options.toleranceUm ?? 1;
  const resolved = { toleranceUm, sizeToleranceUm: options.sizeToleranceUm ?? toleranceUm, maxDistanceUm: options.maxDistanceUm ?? 50 };
  for (const [name, v] of Object.entries(resolved)) {
    if (!Number.isFinite(v) || v < 0) throw new SymmetryInputError(`${name} must be a number of zero or more`);
    if (name === "maxDistanceUm" && v === 0) throw new SymmetryInputError("maxDistanceUm must be a positive number");
  }
  return resolved;
}

/** Distance between the centre of a and the mirror image of the centre of b. */
const pairCost = (a: Prepared, b: Prepared) => Math.hypot(a.centre[0] - b.mirrored[0], a.centre[1] - b.mirrored[1]);

function sizeDifference(a: Prepared, b: Prepared, line: AxisLine): SizeDifference {
  if (a.kind === "trace") return { lengthUm: pathLength(a.geometry) - pathLength(b.geometry) };
  const ba = boundingBox(a.geometry);
  const bb = boundingBox(mirrorGeometry(b.geometry, line));
  return { widthUm: ba.maxX - ba.minX - (bb.maxX - bb.minX), heightUm: ba.maxY - ba.minY - (bb.maxY - bb.minY) };
}

function makePair(a: Prepared, b: Prepared, line: AxisLine, o: Required<SymmetryOptions>): SymmetryPair {
  const offset = { x: a.centre[0] - b.mirrored[0], y: a.centre[1] - b.mirrored[1] };
  const deviationUm = Math.hypot(offset.x, offset.y);
  const size = sizeDifference(a, b, line);
  const sizeOk = Object.values(size).every((d: number) => Math.abs(d) <= o.sizeToleranceUm);
  return {
    kind: a.kind,
    aId: a.id,
    bId: b.id,
    selfPaired: a === b,
    offsetUm: offset,
    deviationUm,
    sizeDifferenceUm: size,
    withinTolerance: deviationUm <= o.toleranceUm && sizeOk,
  };
}

/** Pairs the shapes of one kind: left side (incl. on the axis) against right side. */
function pairKind(shapes: Prepared[], line: AxisLine, o: Required<SymmetryOptions>) {
  const left = shapes.filter((s) => signedDistance(s.centre, line) >= 0);
  const right = shapes.filter((s) => signedDistance(s.centre, line) < 0);
  const cross = left.map((a) => right.map((b) => pairCost(a, b)));
  const alone = (s: Prepared) => aloneChoice(pairCost(s, s), o.maxDistanceUm);
  const result = assignPairs(cross, left.map(alone), right.map(alone), o.maxDistanceUm);
  const pairs = [
    ...result.cross.map(([i, j]) => makePair(left[i], right[j], line, o)),
    ...result.selfP.map((i) => makePair(left[i], left[i], line, o)),
    ...result.selfN.map((j) => makePair(right[j], right[j], line, o)),
  ];
  const unmatched = [...result.unmatchedP.map((i) => left[i]), ...result.unmatchedN.map((j) => right[j])];
  return { pairs, unmatched: unmatched.map((s): UnmatchedShape => ({ id: s.id, kind: s.kind })) };
}

/**
 * Symmetry report for markup shapes across an axis (die µm). Shapes of kinds other than pad,
 * block and trace are ignored. A shape on the axis may be its own partner. The pairing is
 * optimal: it minimises the summed centre offsets, with each unpaired shape costing
 * maxDistanceUm, and never makes a pair whose offset exceeds maxDistanceUm.
 */
export function symmetryReport(shapes: readonly SymmetryShape[], axis: SymmetryAxis, options: SymmetryOptions = {}): SymmetryReport {
  const line = axisLine(axis);
  const o = resolveOptions(options);
  const pairs: SymmetryPair[] = [];
  const unmatched: UnmatchedShape[] = [];
  for (const kind of SYMMETRY_KINDS) {
    const ofKind = shapes
      .filter((s) => s.kind === kind)
      .map((s): Prepared => {
        const centre = shapeCentre(s.geometry);
        return { id: s.id, kind, geometry: s.geometry, centre, mirrored: reflectPoint(centre, line) };
      });
    const result = pairKind(ofKind, line, o);
    pairs.push(...result.pairs);
    unmatched.push(...result.unmatched);
  }
  // Shapes on the axis are their own mirror images: counted apart, never as pairs.
  const mirrored = pairs.filter((p) => !p.selfPaired);
  const onAxis = pairs.filter((p) => p.selfPaired);
  const deviations = mirrored.map((p) => p.deviationUm);
  const total = pairs.reduce((a, p) => a + p.deviationUm, 0);
  return {
    pairs,
    unmatched,
    summary: {
      pairCount: mirrored.length,
      withinToleranceCount: mirrored.filter((p) => p.withinTolerance).length,
      onAxisCount: onAxis.length,
      onAxisWithinToleranceCount: onAxis.filter((p) => p.withinTolerance).length,
      maxDeviationUm: deviations.reduce((m, d) => Math.max(m, d), 0),
      meanDeviationUm: deviations.length ? deviations.reduce((a, b) => a + b, 0) / deviations.length : 0,
      totalDeviationUm: total,
    },
    options: o,
  };
}
