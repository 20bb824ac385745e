import "server-only";

/**
 * The client address a request came from, as the sign-in limits count it: the last entry of
 * `X-Forwarded-For`. `next start` fills that header with the socket's address when the client
 * sent none; behind a reverse proxy that appends the real address, the last entry is the one
 * the proxy saw. A client talking to `next start` directly can put any value there, which is
 * why the limits also cap each account over all addresses it never signed in from.
 */
export function clientAddress(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for") ?? "";
  const last =
    forwarded
      .split(",")
      .map((s) => s.trim())
      .filter(Boolean)
      .pop() ?? "";
  // Addresses are short; anything longer is not one and is cut so it cannot bloat the table.
  return (last || "unknown").slice(0, 64).toLowerCase();
}
