import { handlers } from "@/auth";
import { assertSameOrigin, errorResponse } from "@/server/http/route";

export const { GET } = handlers;

/** Auth.js posts (sign-in, sign-out) are refused from another origin like every other write. */
export async function POST(req: Request): Promise<Response> {
  try {
    assertSameOrigin(req);
  } catch (e) {
    return errorResponse(e);
  }
  // Auth.js types its handler for NextRequest; the route receives one at run time.
  return handlers.POST(req as Parameters<typeof handlers.POST>[0]);
}
