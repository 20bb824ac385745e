// Shapes of what the API answers; the server builds them, client components read them.

/** What the export form shows before a render is queued. */
export type ExportPreviewDto = {
  /** Size and scale of the PNG the request would produce. */
  width: number;
  height: number;
  umPerPx: number;
  warnings: string[];
  /** A small rendering of it (PNG, base64) and its size. */
  png: string;
  previewWidth: number;
  previewHeight: number;
};
