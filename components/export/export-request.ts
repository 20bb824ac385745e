import type { FieldErrors, Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { DieDto } from "@/lib/dto/dies";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { ViewerApi } from "@/components/viewer";
import { MARKUP_KINDS, type MarkupKind } from "@/lib/markup/types";
import { viewBoxUm } from "@/lib/geometry/view-box";
import type { DieRegion } from "@/lib/export/render-plan";
import { exportRequestSchema, type ExportRequest } from "@/lib/validation/exports";

export type RegionMode = "view" | "die" | "typed";

/** What the export form holds; `requestBody` turns it into the request the shared schema checks. */
export type ExportFormValues = {
  /** "" until the user picks one: the form then follows the viewer's micrograph. */
  micrographId: string;
  mode: RegionMode;
  region: DieRegion;
  sizeBy: "width" | "scale";
  widthPx: number;
  umPerPx: number;
  kinds: MarkupKind[];
  labels: boolean;
  threads: boolean;
};

/** The form's first values: whole die at 2048 px wide, all markup with labels, no threads. */
export function exportFormDefaults(die: DieDto): ExportFormValues {
  return {
    micrographId: "",
    mode: "die",
    region: { x: 0, y: 0, width: die.widthUm ?? 1000, height: die.heightUm ?? 1000 },
    sizeBy: "width",
    widthPx: 2048,
    umPerPx: 1,
    kinds: [...MARKUP_KINDS],
    labels: true,
    threads: false,
  };
}

/** The micrograph exported: the one picked, else the one the viewer shows (the list may arrive after the first render). */
export function exportedMicrograph(picked: string, usable: readonly MicrographDto[], shownId: string | undefined): MicrographDto | undefined {
  return usable.find((m) => m.id === picked) ?? usable.find((m) => m.id === shownId) ?? usable[0];
}

/** The die rectangle the viewer shows now, or null when the micrograph is not open in it. */
function currentViewRegion(api: ViewerApi | null, m: MicrographDto | undefined): DieRegion | null {
  if (!api || !m?.transform) return null;
  const el = api.viewer.element;
  const b = viewBoxUm({ width: el.clientWidth, height: el.clientHeight }, api.screenToImage, m.transform);
  return { x: b.minX, y: b.minY, width: b.maxX - b.minX, height: b.maxY - b.minY };
}

const round = (r: DieRegion) => ({ x: +r.x.toFixed(2), y: +r.y.toFixed(2), width: +r.width.toFixed(2), height: +r.height.toFixed(2) });

/** The request body the values describe; "Current view" reads the viewer when called. */
export function exportRequestBody(v: ExportFormValues, micrograph: MicrographDto | undefined, api: ViewerApi | null) {
  const region = v.mode === "view" ? currentViewRegion(api, micrograph) : v.mode === "typed" ? v.region : null;
  if (v.mode === "view" && !region) throw new Error("Open the micrograph in the viewer to export the current view.");
  return {
    micrographId: micrograph?.id ?? "",
    ...(region ? { region: round(region) } : {}),
    ...(v.sizeBy === "width" ? { widthPx: v.widthPx } : { umPerPx: v.umPerPx }),
    kinds: v.kinds,
    labels: v.labels,
    threads: v.threads,
  };
}

type ExportResolver = Resolver<ExportFormValues, unknown, ExportRequest>;
const schemaResolver = zodResolver(exportRequestSchema);

/**
 * The form's resolver: the shared schema checks the request the values describe, not the form's
 * own fields. Its paths (region.x, widthPx, …) are the form's names, so errors land on the fields.
 */
export function exportResolver(body: (v: ExportFormValues) => ReturnType<typeof exportRequestBody>): ExportResolver {
  return async (values, context, options) => {
    let request: ReturnType<typeof exportRequestBody>;
    try {
      request = body(values);
    } catch (e) {
      return { values: {}, errors: { root: { type: "view", message: (e as Error).message } } };
    }
    const result = await schemaResolver(request, context, { criteriaMode: options.criteriaMode, fields: {}, shouldUseNativeValidation: false });
    return result as Awaited<ReturnType<ExportResolver>>;
  };
}

const FIELD_NAME: Record<string, string> = {
  micrographId: "Micrograph",
  region: "Region",
  widthPx: "Output width",
  umPerPx: "Output scale",
  kinds: "Markup shown",
};

/** Each refused field's message, named as the form labels it ("Region width: must be positive"). */
export function exportErrorText(errors: FieldErrors<ExportFormValues>): string {
  if (errors.root?.message) return errors.root.message;
  const parts: string[] = [];
  const walk = (e: unknown, name: string) => {
    if (!e || typeof e !== "object") return;
    const m = (e as { message?: unknown }).message;
    if (typeof m === "string") parts.push(`${name}: ${m}`);
    else for (const [k, v] of Object.entries(e)) walk(v, /^\d+$/.test(k) ? name : `${name} ${k}`);
  };
  for (const [k, v] of Object.entries(errors)) walk(v, FIELD_NAME[k] ?? k);
  return parts.join("; ");
}
