import { handleUploadRequest } from "@/server/uploads/tus-server";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id?: string[] }> };

/** Resumable uploads (tus 1.0.0): POST /api/uploads creates one; HEAD, PATCH, DELETE /api/uploads/{id}. */
const handler = async (req: Request, ctx: Ctx) => handleUploadRequest(req, (await ctx.params).id);

export const POST = handler;
export const HEAD = handler;
export const PATCH = handler;
export const DELETE = handler;
export const OPTIONS = handler;
