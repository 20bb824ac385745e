import type { MicrographDto } from "@/lib/dto/micrographs";
import type { MicrographSource } from "@/components/viewer";

/** The pyramid once tiled, else the preview, else nothing yet. */
export function sourceOf(m: MicrographDto): MicrographSource | null {
  if (m.status === "ready") return { kind: "iiif", infoUrl: `/api/micrographs/${m.id}/iiif/info.json` };
  if (m.previewWidth && m.previewHeight) return { kind: "image", url: `/api/micrographs/${m.id}/preview`, width: m.previewWidth, height: m.previewHeight };
  return null;
}
