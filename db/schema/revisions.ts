// Revisions of a die's markup: what was signed off, frozen byte for byte.
import { boolean, index, integer, jsonb, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import type { FrozenDieFrame, FrozenPadTable } from "@/lib/dto/revisions";
import { dies } from "./dies";
import { users } from "./people";

/**
 * A signed-off revision of a die: its canonical GeoJSON (RFC 8785 canonical JSON) exactly as
 * signed, the SHA-256 of those bytes, the pad table and die frame of that moment, and who signed
 * when. The revision being drawn has no row until it is signed off; the die's `revision` column
 * says which number that is. Rows are never updated.
 */
export const dieRevisions = pgTable(
  "die_revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id")
      .notNull()
      .references(() => dies.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    markupGeojson: text("markup_geojson").notNull(),
    sha256: text("sha256").notNull(),
    shapeCount: integer("shape_count").notNull(),
    padTable: jsonb("pad_table").$type<FrozenPadTable>(),
    dieFrame: jsonb("die_frame").$type<FrozenDieFrame>().notNull(),
    signedOffBy: uuid("signed_off_by").references(() => users.id, { onDelete: "set null" }),
    signedOffByName: text("signed_off_by_name").notNull(),
    signedOffAt: timestamp("signed_off_at", { withTimezone: true }).notNull(),
    /** Signed off while remarks were still open, with the signer's reason in the history. */
    overrideOpenRemarks: boolean("override_open_remarks").notNull().default(false),
  },
  (t) => [unique("die_revisions_die_number_uq").on(t.dieId, t.number), index("die_revisions_die_idx").on(t.dieId)],
);
