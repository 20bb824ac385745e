import "server-only";
import crypto from "node:crypto";
import fs from "node:fs/promises";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { dies, micrographs, users } from "@/db/schema";
import type { Database } from "@/db/client";
import { demoMicrographOptions, renderDemoMicrograph, type DemoRenderOptions } from "@/server/images/demo-die";
import { DEMO } from "@/db/seed";
import { NV24R_LAYOUT } from "@/lib/demo-die/layout";
import { DIE_B_DATE_CODE, withDateCode } from "@/lib/demo-die/date-code";
import type { Look } from "@/lib/demo-die/render-svg";
import { ingestMicrograph } from "./files/ingest";
import { incomingDir } from "./storage";

const CAPTURES = {
  bright_field: { label: "NV-24R 10x bright field", objectiveMag: "10", numericalAperture: "0.3", cameraPixelPitchUm: "2.5" },
  dark_field: { label: "NV-24R 10x dark field", objectiveMag: "10", numericalAperture: "0.3", cameraPixelPitchUm: "2.451" },
  // Die B's picture is taken with the camera binned 2 × 2 (5 µm pixels, 0.5 µm/px at 10x): still
  // finer than half the optics' ≈ 1.1 µm resolution at NA 0.3, and a quarter of the pixels to
  // render at first start.
  bright_field_binned: { label: "NV-24R 10x bright field, 2×2 binned", objectiveMag: "10", numericalAperture: "0.3", cameraPixelPitchUm: "5" },
} as const;
/** Die B's render width: 2 × 2 binning halves the 12000 px of die A's pictures. */
const DIE_B_WIDTH_PX = 6000;

/**
 * Renders one demo micrograph and uploads it through the browser's ingest path as `actor`. A
 * bright-field one becomes the die's reference placed with the renderer's ground-truth
 * transform (as if the analyst had marked the die outline).
 */
async function seedOne(
  db: Database,
  actor: { userId: string },
  dieId: string,
  options: DemoRenderOptions,
  capture: (typeof CAPTURES)[keyof typeof CAPTURES],
  fileName: string,
): Promise<void> {
  const look: Look = options.look;
  await fs.mkdir(incomingDir(), { recursive: true });
  const tempPath = path.join(incomingDir(), `${crypto.randomUUID()}.part`);
  const render = await renderDemoMicrograph(tempPath, options);
  const { size } = await fs.stat(tempPath);
  const m = await ingestMicrograph(db, actor, dieId, { tempPath, bytes: size, format: "jpeg", clientName: fileName }, { ...capture, illumination: look });
  if (look !== "bright_field") return;
  const t = render.imageToDie;
  await db
    .update(micrographs)
    .set({
      transform: [
        [t[0][0], t[0][1], t[0][2]],
        [t[1][0], t[1][1], t[1][2]],
      ],
      scaleUmPerPx: render.umPerPx,
    })
    .where(and(eq(micrographs.id, m.id), eq(micrographs.isReference, true)));
}

/**
 * Renders the invented NV-24R die and uploads the demo micrographs as the demo analyst. Die A
 * gets a bright-field reference and a dark-field one that is rotated, shifted and scaled
 * against it and waits to be aligned; die B, marked completely, gets its bright-field
 * reference with its own date code printed on the die.
 */
export async function seedDemoMicrographs(db: Database): Promise<void> {
  const [analyst] = await db.select().from(users).where(eq(users.email, DEMO.users[1].email));
  const [dieA] = await db.select().from(dies).where(eq(dies.name, DEMO.die.name));
  const [dieB] = await db.select().from(dies).where(eq(dies.name, DEMO.dieB.name));
  if (!analyst) return;
  const actor = { userId: analyst.id };
  if (dieA) {
    for (const look of ["bright_field", "dark_field"] as const) {
      await seedOne(db, actor, dieA.id, demoMicrographOptions(look), CAPTURES[look], `nv24r-${look.replace("_", "-")}.jpg`);
    }
  }
  if (dieB) {
    const layout = withDateCode(NV24R_LAYOUT, DIE_B_DATE_CODE);
    const options = { ...demoMicrographOptions("bright_field", DIE_B_WIDTH_PX), layout };
    await seedOne(db, actor, dieB.id, options, CAPTURES.bright_field_binned, "nv24r-die-b-bright-field.jpg");
  }
}
