// Child process for the export benchmark: renders one annotated PNG of the whole benchmark image
// with N generated shapes and prints wall time and peak RSS (libvips runs in this process).
import { planRender } from "@/lib/export/render-plan";
import { renderAnnotatedPngFile } from "@/server/images/render-png";
import type { AnyShape } from "@/lib/markup/types";

const [input, out, widthArg, shapesArg] = process.argv.slice(2);
const SIZE = 20_000;
const UM_PER_PX = 0.5;
const dieUm = SIZE * UM_PER_PX;

function shapes(n: number): AnyShape[] {
  const list: AnyShape[] = [];
  for (let i = 0; i < n; i++) {
    const x = ((i * 7919) % 997) * (dieUm / 1000);
    const y = ((i * 104729) % 991) * (dieUm / 1000);
    const base = { id: `00000000-0000-4000-8000-${String(i).padStart(12, "0")}`, version: 1, createdBy: null, updatedAt: "2025-01-01T00:00:00.000Z" };
    list.push(
      i % 2 === 0
        ? ({
            ...base,
            kind: "pad",
            geometry: {
              type: "Polygon",
              coordinates: [
                [
                  [x, y],
                  [x + 40, y],
                  [x + 40, y + 40],
                  [x, y + 40],
                  [x, y],
                ],
              ],
            },
            properties: { label: `P${i}`, net: "", state: "bonded" },
          } as AnyShape)
        : ({
            ...base,
            kind: "trace",
            geometry: {
              type: "LineString",
              coordinates: [
                [x, y],
                [x + 120, y],
                [x + 120, y + 80],
              ],
            },
            properties: { widthUm: 3, label: `T${i}` },
          } as AnyShape),
    );
  }
  return list;
}

const planned = planRender(
  {
    width: SIZE,
    height: SIZE,
    transform: [
      [UM_PER_PX, 0, 0],
      [0, -UM_PER_PX, dieUm],
    ],
  },
  { widthUm: dieUm, heightUm: dieUm },
  { widthPx: Number(widthArg) },
);
if (!planned.ok) throw new Error(planned.message);
const title = {
  caseTitle: "Bench case",
  dieName: "bench die",
  micrograph: "bench 400 Mpx",
  illumination: "Bright field",
  umPerPx: planned.plan.umPerPx,
  date: "2025-01-01",
  author: "bench",
  revision: "Revision 1 · draft, not signed off",
};
const t0 = performance.now();
const info = await renderAnnotatedPngFile(
  { original: input, pixelCap: 2_500_000_000, plan: planned.plan, shapes: shapes(Number(shapesArg)), threads: [], labels: true, title },
  out,
);
const seconds = (performance.now() - t0) / 1000;
console.log(JSON.stringify({ seconds, peakRssMb: process.resourceUsage().maxRSS / 1024, width: info.width, height: info.height, bytes: info.bytes }));
