/**
 * Estimates saved on a shape (`properties.estimates`): one small flat record per estimate
 * kind, holding the inputs, the numbers, the formula's short name and its source, within the
 * limits the markup API enforces (at most 32 values; strings of at most 200 characters).
 */
import type { SavedEstimate, SavedEstimates } from "../markup/types";

/** The estimate kinds a shape can carry, with the name shown for each formula. */
const SAVED_ESTIMATE_NAMES = {
  "bond-wire": "Bond-wire inductance (Rosa; Grover)",
  strip: "Straight bar inductance (Grover; Terman)",
  spiral: "Planar spiral inductance (Mohan et al. 1999)",
  microstrip: "Microstrip impedance (Hammerstad & Jensen)",
  cpw: "Coplanar waveguide impedance (Wen; Ghione & Naldi)",
} as const;
export type SavedEstimateKind = keyof typeof SAVED_ESTIMATE_NAMES;

/** Largest number of values, and longest string, a saved estimate may hold (as the API's schema). */
const MAX_FIELDS = 32;
const MAX_TEXT = 200;

type Flat = Record<string, number | string | boolean | null | undefined>;
type ResultLike = { readonly source: string; readonly warnings: readonly string[] } & Readonly<Record<string, unknown>>;

const clip = (s: string) => (s.length > MAX_TEXT ? `${s.slice(0, MAX_TEXT - 1)}…` : s);

/**
 * The record stored for one estimate: the inputs given, every finite number of the result,
 * the formula's name, its source, the warnings (joined) and when it was saved.
 */
export function toSavedEstimate(kind: SavedEstimateKind, inputs: Flat, result: ResultLike, savedAt: string): SavedEstimate {
  const record: Record<string, number | string | boolean | null> = { kind, formula: SAVED_ESTIMATE_NAMES[kind], source: clip(result.source) };
  for (const [k, v] of Object.entries(inputs)) {
    if (v === undefined || (typeof v === "number" && !Number.isFinite(v))) continue;
    record[k] = typeof v === "string" ? clip(v) : v;
  }
  for (const [k, v] of Object.entries(result)) {
    if (typeof v === "number" && Number.isFinite(v)) record[k] = v;
  }
  if (result.warnings.length > 0) record.warnings = clip(result.warnings.join("; "));
  record.savedAt = savedAt;
  const entries = Object.entries(record);
  if (entries.length > MAX_FIELDS) throw new RangeError(`a saved estimate holds at most ${MAX_FIELDS} values`);
  return record;
}

/** Three significant figures without an exponent, as read off a layout (1.02, 49.8, 0.865). */
export function threeFigures(v: number): string {
  if (!Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const digits = Math.max(0, 2 - Math.floor(Math.log10(Math.abs(v))));
  return v.toFixed(Math.min(digits, 12));
}

/** One saved estimate in a few characters: "L 1.02 nH" or "Z0 49.8 Ω"; null when unreadable. */
export function summariseSavedEstimate(e: SavedEstimate): string | null {
  if (typeof e.inductanceNh === "number") return `L ${threeFigures(e.inductanceNh)} nH`;
  if (typeof e.z0Ohm === "number") return `Z0 ${threeFigures(e.z0Ohm)} Ω${e.kind === "cpw" ? " (CPW)" : e.kind === "microstrip" ? " (microstrip)" : ""}`;
  return null;
}

/** Reads `properties.estimates` defensively (imported or older shapes may hold anything). */
export function savedEstimatesOf(properties: Readonly<Record<string, unknown>>): SavedEstimates {
  const e = properties.estimates;
  if (!e || typeof e !== "object" || Array.isArray(e)) return {};
  return Object.fromEntries(
    Object.entries(e as Record<string, unknown>).filter(([, v]) => v !== null && typeof v === "object" && !Array.isArray(v)),
  ) as SavedEstimates;
}

/** Every saved estimate of a shape as one line: "L 0.865 nH · Z0 49.8 Ω (microstrip)". */
export function summariseSavedEstimates(properties: Readonly<Record<string, unknown>>): string {
  return Object.values(savedEstimatesOf(properties))
    .map(summariseSavedEstimate)
    .filter((s): s is string => s !== null)
    .join(" · ");
}

/** The shape's estimates with one replaced (or added), ready for `editor.updateProperties`. */
export function withSavedEstimate(properties: Readonly<Record<string, unknown>>, kind: SavedEstimateKind, record: SavedEstimate): SavedEstimates {
  return { ...savedEstimatesOf(properties), [kind]: record };
}
