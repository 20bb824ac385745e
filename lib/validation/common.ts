import { z } from "zod";

/** Ids in paths and bodies are user input: only canonical UUIDs pass. */
export const uuidSchema = z.string().regex(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i, "must be a UUID");

/** A single-line text field with a length cap; surrounding white space is trimmed. */
export const line = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`);
