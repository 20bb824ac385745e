import { z } from "zod";
import { uuidSchema } from "./common";
import { roleSchema } from "./teams";
import { anyGeometrySchema } from "./markup";
import { REVIEW_ACTIONS } from "@/lib/dto/stored-values";

/** Longest comment or review message accepted. */
const MAX_COMMENT_CHARS = 10_000;

const body = z
  .string({ error: "must be text" })
  .max(MAX_COMMENT_CHARS, `must be at most ${MAX_COMMENT_CHARS} characters`)
  .refine((s) => s.trim().length > 0, "must not be empty");

/** A region drawn for a thread: a GeoJSON Polygon in die µm. */
const regionSchema = anyGeometrySchema.refine((g) => g.type === "Polygon", "must be a GeoJSON Polygon");

/** A new thread: on a shape, or on a region, with its first comment. */
export const newThreadSchema = z.union([z.strictObject({ shapeId: uuidSchema, body }), z.strictObject({ region: regionSchema, body })], {
  error: "send { shapeId, body } or { region, body }",
});
export type NewThreadInput = z.infer<typeof newThreadSchema>;

export const commentSchema = z.strictObject({ body });

export const reviewActionSchema = z.strictObject({
  action: z.enum(REVIEW_ACTIONS, `must be one of ${REVIEW_ACTIONS.join(", ")}`),
  message: z.string({ error: "must be text" }).max(MAX_COMMENT_CHARS, `must be at most ${MAX_COMMENT_CHARS} characters`).default(""),
  /** Sign off although remarks are still open: needs a message, which the history keeps. */
  overrideOpenRemarks: z.boolean({ error: "must be true or false" }).optional(),
});
export type ReviewActionInput = z.infer<typeof reviewActionSchema>;

export const invitationSchema = z.strictObject({
  email: z.string().trim().toLowerCase().pipe(z.email("must be an e-mail address")).pipe(z.string().max(320)),
  role: roleSchema,
});

export const acceptInvitationSchema = z.strictObject({
  token: z.string().min(20).max(200),
  name: z.string().trim().min(1, "must not be empty").max(120).optional(),
  password: z.string().min(8, "must be at least 8 characters").max(200).optional(),
});

export const activityQuerySchema = z.strictObject({
  before: z
    .string()
    .regex(/^\d{4}-\d\d-\d\dT[\d:.]+Z~[0-9a-f-]{36}$/i, "must be a cursor from an earlier page")
    .optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

export const NOTIFICATION_KINDS = ["comment", "mention", "review_submitted", "review_decision"] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];
export const notificationPrefsSchema = z.strictObject(
  Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k, z.boolean().optional()])) as Record<NotificationKind, z.ZodOptional<z.ZodBoolean>>,
);
