/**
 * Quasi-static microstrip analysis: Hammerstad & Jensen, "Accurate models for microstrip
 * computer-aided design", IEEE MTT-S Digest 1980, eqs (1)–(9), with their strip-thickness
 * correction. No dispersion: values hold well below the first higher-order mode.
 */
import { ETA0 } from "./constants";
import { requireNonNegative, requirePermittivity, requirePositive } from "./input-error";
import type { EstimateMeta } from "./types";

export type MicrostripInput = { widthUm: number; heightUm: number; er: number; thicknessUm?: number };
export type MicrostripEstimate = EstimateMeta & { z0Ohm: number; effectivePermittivity: number; widthOverHeight: number };

/** Impedance of the strip in air, Z01(u), u = W/h (H&J eqs 1–2). */
function airImpedance(u: number): number {
  const f = 6 + (2 * Math.PI - 6) * Math.exp(-Math.pow(30.666 / u, 0.7528));
  return (ETA0 / (2 * Math.PI)) * Math.log(f / u + Math.sqrt(1 + 4 / (u * u)));
}

/** Effective permittivity εe(u, εr) for a zero-thickness strip (H&J eqs 3–5). */
function zeroThicknessPermittivity(u: number, er: number): number {
  const u4 = u ** 4;
  const a = 1 + Math.log((u4 + (u / 52) ** 2) / (u4 + 0.432)) / 49 + Math.log(1 + (u / 18.1) ** 3) / 18.7;
  const b = 0.564 * Math.pow((er - 0.9) / (er + 3), 0.053);
  return (er + 1) / 2 + ((er - 1) / 2) * Math.pow(1 + 10 / u, -a * b);
}

/**
 * Z0 and εe for normalised width u = W/h and normalised thickness tn = t/h (H&J eqs 6–9):
 * the strip is widened by Δu1 in air and Δur in the dielectric.
 */
export function hammerstadJensen(u: number, er: number, tn: number): { z0: number; ee: number } {
  if (tn === 0) {
    const ee = zeroThicknessPermittivity(u, er);
    return { z0: airImpedance(u) / Math.sqrt(ee), ee };
  }
  const coth = 1 / Math.tanh(Math.sqrt(6.517 * u));
  const du1 = (tn / Math.PI) * Math.log(1 + (4 * Math.E) / (tn * coth * coth));
  const dur = 0.5 * (1 + 1 / Math.cosh(Math.sqrt(er - 1))) * du1;
  const u1 = u + du1;
  const ur = u + dur;
  const eeR = zeroThicknessPermittivity(ur, er);
  const z0 = airImpedance(ur) / Math.sqrt(eeR);
  const ee = eeR * (airImpedance(u1) / airImpedance(ur)) ** 2;
  return { z0, ee };
}

/** Warnings for inputs outside the accuracy range Hammerstad & Jensen state (recalled, not re-read). */
export function microstripWarnings(u: number, er: number, tn: number): string[] {
  const warnings: string[] = [];
  if (u < 0.01 || u > 100) warnings.push(`W/h = ${u.toPrecision(3)} is outside 0.01–100, the range Hammerstad & Jensen state for their accuracy`);
  if (er > 128) warnings.push("er above 128 is outside the range Hammerstad & Jensen state for their accuracy");
  if (tn > 0.1) warnings.push("thicknessUm above 0.1·heightUm: the thickness correction is a first-order one");
  return warnings;
}

export const MICROSTRIP_SOURCE = "Hammerstad & Jensen, IEEE MTT-S International Microwave Symposium Digest, 1980 (quasi-static)";
export const MICROSTRIP_FORMULA = "Z0 = Z01(ur)/√εe(ur), Z01(u) = η0/2π·ln[f(u)/u + √(1 + 4/u²)], εe = εe(ur)·[Z01(u1)/Z01(ur)]² (Hammerstad & Jensen eqs 1–9)";

/** Characteristic impedance and effective permittivity of a microstrip of given width. */
export function microstripAnalysis(input: MicrostripInput): MicrostripEstimate {
  const w = requirePositive("widthUm", input.widthUm);
  const h = requirePositive("heightUm", input.heightUm);
  const er = requirePermittivity("er", input.er);
  const t = requireNonNegative("thicknessUm", input.thicknessUm ?? 0);
  const u = w / h;
  const { z0, ee } = hammerstadJensen(u, er, t / h);
  return {
    z0Ohm: z0,
    effectivePermittivity: ee,
    widthOverHeight: u,
    units: { z0Ohm: "Ω", effectivePermittivity: "1", widthOverHeight: "1" },
    formula: MICROSTRIP_FORMULA,
    source: MICROSTRIP_SOURCE,
    warnings: microstripWarnings(u, er, t / h),
  };
}
