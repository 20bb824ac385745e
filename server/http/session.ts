import "server-only";
import { auth } from "@/auth";
import { UnauthorizedError } from "@/lib/errors";
import type { Actor } from "@/server/access/context";

/** The signed-in caller, or null. */
export async function currentActor(): Promise<(Actor & { email: string; name: string }) | null> {
  const session = await auth();
  const id = session?.user?.id;
  if (!id) return null;
  return { userId: id, email: session.user.email ?? "", name: session.user.name ?? "" };
}

/** The signed-in caller; throws 401 otherwise. */
export async function requireActor(): Promise<Actor & { email: string; name: string }> {
  const actor = await currentActor();
  if (!actor) throw new UnauthorizedError();
  return actor;
}
