import { describe, expect, it } from "vitest";
import type { ResolverOptions } from "react-hook-form";
import type { DieDto } from "@/lib/dto/dies";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { exportErrorText, exportFormDefaults, exportRequestBody, exportResolver, type ExportFormValues } from "./export-request";

// Consistency tests of the form → request step: the limits come from lib/validation/exports.ts.
const die = { widthUm: 2400, heightUm: 1600 } as DieDto;
const micrograph = {
  id: "5b0f3c1e-8d4a-4e7b-9c2f-1a6d3e8b7c40",
  transform: [
    [1, 0, 0],
    [0, -1, 1600],
  ],
} as unknown as MicrographDto;
const options = { fields: {}, shouldUseNativeValidation: false } as ResolverOptions<ExportFormValues>;
const body = (v: ExportFormValues) => exportRequestBody(v, micrograph, null);

describe("export form request", () => {
  it("sends the whole die at 2048 px with every kind by default", () => {
    const r = body(exportFormDefaults(die));
    expect(r).toMatchObject({ micrographId: micrograph.id, widthPx: 2048, labels: true, threads: false });
    expect(r).not.toHaveProperty("region");
    expect(r).not.toHaveProperty("umPerPx");
  });

  it("sends a typed rectangle and a scale instead of a width", () => {
    const v = {
      ...exportFormDefaults(die),
      mode: "typed" as const,
      region: { x: 200, y: 200, width: 1200, height: 900 },
      sizeBy: "scale" as const,
      umPerPx: 2,
    };
    expect(body(v)).toMatchObject({ region: { x: 200, y: 200, width: 1200, height: 900 }, umPerPx: 2 });
    expect(body(v)).not.toHaveProperty("widthPx");
  });

  it("names the refused fields as the form labels them", async () => {
    const v = { ...exportFormDefaults(die), mode: "typed" as const, region: { x: 0, y: 0, width: -5, height: 900 }, widthPx: 20_000 };
    const result = await exportResolver(body)(v, undefined, options);
    expect(exportErrorText(result.errors)).toBe("Region width: must be positive; Output width: must be at most 16384");
  });

  it("refuses the current view while the micrograph is not open in the viewer", async () => {
    const result = await exportResolver(body)({ ...exportFormDefaults(die), mode: "view" }, undefined, options);
    expect(exportErrorText(result.errors)).toBe("Open the micrograph in the viewer to export the current view.");
  });

  it("passes valid values through as the parsed request", async () => {
    const result = await exportResolver(body)(exportFormDefaults(die), undefined, options);
    expect(result.errors).toEqual({});
    expect(result.values).toMatchObject({ micrographId: micrograph.id, widthPx: 2048 });
  });
});
