import "server-only";
import { sql } from "drizzle-orm";
import { auditEvents, cases, dies, memberships, teams, users } from "./schema";
import type { Database } from "./client";
import { hashPassword } from "@/lib/auth/password";
import { seedDemoSample } from "./seed-sample";
import { DEMO_DIE_B, seedDieB } from "./seed-die-b";

/** The password of every demo account (documented in the README). */
const DEMO_PASSWORD = "fjordlight-demo";

/** The invented demo scenario: team, users, case and die. Names are fiction. */
export const DEMO = {
  team: "Fjordlight Failure Lab",
  otherTeam: "Elsewhere Imaging Group",
  users: [
    { email: "owner@fjordlight.test", name: "Demo Owner", role: "owner" },
    { email: "analyst@fjordlight.test", name: "Demo Analyst", role: "analyst" },
    { email: "reviewer@fjordlight.test", name: "Demo Reviewer", role: "reviewer" },
    { email: "viewer@fjordlight.test", name: "Demo Viewer", role: "viewer" },
  ],
  outsider: { email: "outsider@elsewhere.test", name: "Demo Outsider" },
  case: {
    title: "NV-24R receiver teardown",
    partMarking: "NV24R-A1 · 2447",
    package: "QFN-24, 4 × 4 mm, moulded",
    sampleId: "FFL-2026-0142",
    notes:
      "Fictional 24 GHz radar receiver front end by the invented maker Nordvik Semiconductor, SiGe BiCMOS. " +
      "Differential layout, mirror-symmetric about a horizontal axis: LNA, mixer, IF buffer. " +
      "Opened by acid decapsulation in the wet lab: see the sample record.",
  },
  die: {
    name: "NV-24R die A",
    widthUm: 2400,
    heightUm: 1600,
    notes: "Die about 2.40 mm × 1.60 mm, 22 bond pads. Marks on the die: NORDVIK, NV-24R, mask id NVK-M4417B, date code 2318.",
  },
  /** A second die of the same part, seeded fully marked (db/seed-die-b.ts). */
  dieB: DEMO_DIE_B,
} as const;

/** Seeds the demo scenario when the database has no users yet. Returns whether it seeded. */
export async function seedDemo(db: Database): Promise<boolean> {
  const [{ n }] = await db.select({ n: sql<number>`count(*)::int` }).from(users);
  if (n > 0) return false;
  const hash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (tx) => {
    const [team] = await tx.insert(teams).values({ name: DEMO.team }).returning();
    const [other] = await tx.insert(teams).values({ name: DEMO.otherTeam }).returning();
    const ids: Record<string, string> = {};
    for (const u of DEMO.users) {
      const [row] = await tx.insert(users).values({ email: u.email, name: u.name, passwordHash: hash }).returning();
      ids[u.role] = row.id;
      await tx.insert(memberships).values({ teamId: team.id, userId: row.id, role: u.role });
    }
    const [outsider] = await tx
      .insert(users)
      .values({ ...DEMO.outsider, passwordHash: hash })
      .returning();
    await tx.insert(memberships).values({ teamId: other.id, userId: outsider.id, role: "owner" });
    const [c] = await tx
      .insert(cases)
      .values({ ...DEMO.case, teamId: team.id, createdBy: ids.analyst })
      .returning();
    await seedDemoSample(tx, c.id, { id: ids.analyst, name: "Demo Analyst" });
    const [d] = await tx
      .insert(dies)
      .values({ ...DEMO.die, caseId: c.id, analystId: ids.analyst, createdBy: ids.analyst })
      .returning();
    await tx.insert(auditEvents).values({
      teamId: team.id,
      actorId: ids.analyst,
      action: "die.created",
      entityType: "die",
      entityId: d.id,
      dieId: d.id,
      after: JSON.parse(JSON.stringify(d)),
    });
    // Die B, read completely; its review history can be added here from the id it returns.
    await seedDieB(tx, { teamId: team.id, caseId: c.id, analystId: ids.analyst, reviewerId: ids.reviewer, after: d.createdAt });
  });
  return true;
}
