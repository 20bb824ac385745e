import "server-only";
import { notFound, redirect } from "next/navigation";
import { connection } from "next/server";
import { currentActor } from "./session";
import { NotFoundError } from "@/lib/errors";
import { database } from "@/server/database";
import { type Database } from "@/db/client";
import type { Actor } from "@/server/access/context";

/**
 * Server pages get the caller and the database here: signed-out visitors go to sign-in, and
 * anything the data-access layer reports as not found (including other teams' items) becomes
 * the 404 page. Pages are always rendered per request, never at build time.
 */
export async function loadPage<T>(load: (ctx: { actor: Actor & { name: string; email: string }; db: Database }) => Promise<T>): Promise<T> {
  await connection();
  const actor = await currentActor();
  if (!actor) redirect("/sign-in");
  try {
    return await load({ actor, db: await database() });
  } catch (e) {
    if (e instanceof NotFoundError) notFound();
    throw e;
  }
}
