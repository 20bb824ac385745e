/**
 * Scale of a micrograph in µm per pixel, from capture data or from a two-point calibration.
 * Object-space pixel size = camera pixel pitch / (objective magnification × adapter
 * magnification) (see REFERENCES.md, "Scale and optics").
 */
export function scaleFromCapture(c: { cameraPixelPitchUm: number; objectiveMag: number; adapterMag?: number | null }): number {
  const adapter = c.adapterMag ?? 1;
  const s = c.cameraPixelPitchUm / (c.objectiveMag * adapter);
  if (!Number.isFinite(s) || s <= 0) throw new RangeError("capture data give no positive scale");
  return s;
}

/** Scale from two image points on a feature of known length (µm per image pixel). */
export function scaleFromCalibration(p1: readonly [number, number], p2: readonly [number, number], lengthUm: number): number {
  const px = Math.hypot(p2[0] - p1[0], p2[1] - p1[1]);
  if (!(px > 0)) throw new RangeError("the two calibration points coincide");
  if (!(lengthUm > 0) || !Number.isFinite(lengthUm)) throw new RangeError("the known length must be positive");
  return lengthUm / px;
}
