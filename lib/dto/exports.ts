// Shapes of what the API answers; the server builds them, client components read them.
import type { ExportRequest } from "@/lib/validation/exports";
import type { ExportKind, JobStatus } from "@/lib/dto/stored-values";

/** What the renderer wrote back into the export's params once done. */
export type ExportResult = {
  width: number;
  height: number;
  umPerPx: number;
  warnings: string[];
  scaleBar: { lengthUm: number; label: string; px: number; x: number; y: number };
};

export type ExportDto = {
  id: string;
  dieId: string;
  micrographId: string | null;
  kind: ExportKind;
  status: JobStatus;
  progress: number;
  request: ExportRequest;
  result: ExportResult | null;
  warnings: string[];
  fileName: string | null;
  bytes: number | null;
  error: string | null;
  createdBy: string | null;
  createdByName: string | null;
  createdAt: string;
  finishedAt: string | null;
  fileUrl: string | null;
};
