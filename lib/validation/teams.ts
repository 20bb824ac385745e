import { z } from "zod";
import { ROLES } from "@/lib/auth/permissions";

export const roleSchema = z.enum(ROLES, "must be one of owner, analyst, reviewer, viewer");
export const memberPatchSchema = z.strictObject({ role: roleSchema });
