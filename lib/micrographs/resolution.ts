/** Middle of the visible band; the wavelength assumed when the illumination is not given. */
export const DEFAULT_WAVELENGTH_NM = 550;

/**
 * Lateral optical resolution by the Rayleigh criterion, d = 0.61·λ/NA (Born & Wolf,
 * Principles of Optics), in µm.
 */
export function rayleighResolutionUm(numericalAperture: number, wavelengthNm: number = DEFAULT_WAVELENGTH_NM): number {
  if (!(numericalAperture > 0) || !Number.isFinite(numericalAperture)) throw new RangeError("numericalAperture must be a positive number");
  if (!(wavelengthNm > 0) || !Number.isFinite(wavelengthNm)) throw new RangeError("wavelengthNm must be a positive number");
  return (0.61 * (wavelengthNm / 1000)) / numericalAperture;
}

/**
 * Nyquist: a pixel must be at most half the resolved distance to sample it; larger pixels
 * make detail finer than about two pixels meaningless.
 */
export function isUnderSampled(umPerPx: number, resolutionUm: number): boolean {
  return umPerPx > resolutionUm / 2;
}
