/**
 * Microscope optics for a micrograph: object-space pixel size, lateral resolution (Rayleigh
 * and Abbe) and depth of field, with a Nyquist check of the sampling.
 */
import { requirePositive } from "./input-error";
import type { EstimateMeta } from "./types";

export type OpticsInput = {
  numericalAperture: number;
  /** Illumination wavelength; 550 nm is the middle of the visible band. */
  wavelengthNm?: number;
  cameraPixelPitchUm: number;
  objectiveMag: number;
  /** Camera adapter (relay) magnification. */
  adapterMag?: number;
  /** Refractive index of the medium between objective and die: 1 for air. */
  refractiveIndex?: number;
};

export type OpticsEstimate = EstimateMeta & {
  rayleighUm: number;
  abbeUm: number;
  objectPixelUm: number;
  depthOfFieldUm: number;
  totalMagnification: number;
  /** Largest object pixel that still samples the Rayleigh distance twice (Nyquist). */
  nyquistPixelUm: number;
};

/**
 * Optics estimate. Depth of field is d = λ·n/NA² + n·e/(M·NA): a wave-optical term plus the
 * detector term with e the camera pixel pitch and M the total magnification (Inoué & Spring,
 * 2nd ed., 1997 — attribution recalled from memory).
 */
export function opticsEstimate(input: OpticsInput): OpticsEstimate {
  const na = requirePositive("numericalAperture", input.numericalAperture);
  const lambdaUm = requirePositive("wavelengthNm", input.wavelengthNm ?? 550) / 1000;
  const pitch = requirePositive("cameraPixelPitchUm", input.cameraPixelPitchUm);
  const objective = requirePositive("objectiveMag", input.objectiveMag);
  const adapter = requirePositive("adapterMag", input.adapterMag ?? 1);
  const n = requirePositive("refractiveIndex", input.refractiveIndex ?? 1);
  const m = objective * adapter;
  const rayleighUm = (0.61 * lambdaUm) / na;
  const objectPixelUm = pitch / m;
  const warnings: string[] = [];
  if (na >= n) warnings.push(`numericalAperture ${na} is not below the refractive index ${n}: set refractiveIndex for an immersion objective`);
  if (objectPixelUm > rayleighUm / 2) {
    warnings.push(`object pixel ${objectPixelUm.toPrecision(3)} µm is larger than half the Rayleigh distance: the image is undersampled (Nyquist)`);
  }
  if (lambdaUm < 0.2 || lambdaUm > 2) warnings.push("wavelengthNm outside 200–2000 nm is unusual for optical microscopy");
  return {
    rayleighUm,
    abbeUm: lambdaUm / (2 * na),
    objectPixelUm,
    depthOfFieldUm: (lambdaUm * n) / (na * na) + (n * pitch) / (m * na),
    totalMagnification: m,
    nyquistPixelUm: rayleighUm / 2,
    units: { rayleighUm: "µm", abbeUm: "µm", objectPixelUm: "µm", depthOfFieldUm: "µm", totalMagnification: "1", nyquistPixelUm: "µm" },
    formula: "pixel = pitch/(M_obj·M_adapter); Rayleigh d = 0.61·λ/NA; Abbe d = λ/(2·NA); depth of field = λ·n/NA² + n·e/(M·NA)",
    source: "Rayleigh criterion and Abbe limit (Born & Wolf, Principles of Optics); depth of field after Inoué & Spring, 2nd ed., 1997",
    warnings,
  };
}
