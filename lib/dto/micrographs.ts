// Shapes of what the API answers; the server builds them, client components read them.
import type { TeamRole } from "@/lib/auth/permissions";
import type { Illumination, MicrographStatus } from "@/lib/dto/stored-values";
import type { Transform } from "@/lib/geometry/types";

/** A two-point scale calibration: two image points a known length apart. */
export type ScaleCalibration = { p1: [number, number]; p2: [number, number]; lengthUm: number };

export type MicrographDto = {
  id: string;
  dieId: string;
  label: string;
  status: MicrographStatus;
  progress: number;
  width: number | null;
  height: number | null;
  scaleUmPerPx: number | null;
  illumination: Illumination;
  objectiveMag: number | null;
  numericalAperture: number | null;
  cameraPixelPitchUm: number | null;
  adapterMag: number | null;
  transform: Transform | null;
  isReference: boolean;
  calibration: ScaleCalibration | null;
  format: string | null;
  bytes: number | null;
  previewWidth: number | null;
  previewHeight: number | null;
  position: number;
  error?: string;
  yourRole: TeamRole;
  createdAt: string;
  updatedAt: string;
};
