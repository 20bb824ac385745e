import "server-only";
import crypto from "node:crypto";
import fs from "node:fs/promises";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { dies, micrographs, users } from "@/db/schema";
import type { Database } from "@/db/client";
import { demoMicrographOptions, renderDemoMicrograph } from "@/server/images/demo-die";
import { DEMO } from "@/db/seed";
import { ingestMicrograph } from "./files/ingest";
import { incomingDir } from "./files/storage-paths";

/**
 * Renders the invented NV-24R die as a bright-field and a dark-field micrograph and uploads
 * both through the same ingest path as a browser upload, as the demo analyst. The bright-field
 * one is the reference, placed with the renderer's ground-truth transform (as if the analyst
 * had marked the die outline); the dark-field one is rotated, shifted and scaled against it
 * and waits to be aligned.
 */
export async function seedDemoMicrographs(db: Database): Promise<void> {
  const [analyst] = await db.select().from(users).where(eq(users.email, DEMO.users[1].email));
  const [die] = await db.select().from(dies).where(eq(dies.name, DEMO.die.name));
  if (!analyst || !die) return;
  const actor = { userId: analyst.id };
  const captures = {
    bright_field: { label: "NV-24R 10x bright field", objectiveMag: "10", numericalAperture: "0.3", cameraPixelPitchUm: "2.5" },
    dark_field: { label: "NV-24R 10x dark field", objectiveMag: "10", numericalAperture: "0.3", cameraPixelPitchUm: "2.451" },
  } as const;
  for (const look of ["bright_field", "dark_field"] as const) {
    await fs.mkdir(incomingDir(), { recursive: true });
    const tempPath = path.join(incomingDir(), `${crypto.randomUUID()}.part`);
    const render = await renderDemoMicrograph(tempPath, demoMicrographOptions(look));
    const { size } = await fs.stat(tempPath);
    const m = await ingestMicrograph(
      db,
      actor,
      die.id,
      { tempPath, bytes: size, format: "jpeg", clientName: `nv24r-${look.replace("_", "-")}.jpg` },
      { ...captures[look], illumination: look },
    );
    if (look === "bright_field") {
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
  }
}
