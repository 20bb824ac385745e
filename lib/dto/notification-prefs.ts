// Shapes of what the API answers; the server builds them, client components read them.
import type { NotificationKind } from "@/lib/validation/review";

export type NotificationPrefs = Record<NotificationKind, boolean>;
