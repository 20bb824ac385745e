// A small tus 1.0.0 client over fetch (https://tus.io/protocols/resumable-upload), written from
// the specification so the tests check the server against the protocol, not against tus-js-client.
import type { ApiClient } from "./client";

export const TUS_VERSION = { "Tus-Resumable": "1.0.0" };

/** Upload-Metadata (§Creation): comma-separated "key base64(value)" pairs. */
function uploadMetadata(m: Record<string, string>): string {
  return Object.entries(m)
    .map(([k, v]) => `${k} ${Buffer.from(v, "utf8").toString("base64")}`)
    .join(",");
}

export type TusAnswer<T = unknown> = { status: number; offset: number | null; location: string | null; body: T; headers: Headers };

async function answer<T>(res: Response): Promise<TusAnswer<T>> {
  const text = await res.text();
  let body: unknown = text;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON */
  }
  const offset = res.headers.get("upload-offset");
  return { status: res.status, offset: offset === null ? null : Number(offset), location: res.headers.get("location"), body: body as T, headers: res.headers };
}

/** A client for one signed-in user; paths are resolved against the server's base URL. */
export function tusClient(client: ApiClient) {
  const url = (p: string) => new URL(p, `${client.baseUrl}/api/uploads`).toString();
  const send = (method: string, p: string, headers: Record<string, string>, body?: Uint8Array) =>
    fetch(url(p), { method, headers: { cookie: client.cookie, ...TUS_VERSION, ...headers }, body: body as BodyInit | undefined }).then((r) => answer(r));
  return {
    url,
    /** POST (§Creation): answers 201 with Location, or a refusal. */
    create: <T = unknown>(size: number, metadata: Record<string, string>, extra: Record<string, string> = {}) =>
      send("POST", "/api/uploads", { "Upload-Length": String(size), "Upload-Metadata": uploadMetadata(metadata), ...extra }) as Promise<TusAnswer<T>>,
    /** HEAD (§Core: HEAD): the offset the server holds. */
    head: (location: string) => send("HEAD", location, {}),
    /** PATCH (§Core: PATCH): bytes from `offset`. */
    patch: <T = unknown>(location: string, offset: number, bytes: Uint8Array, extra: Record<string, string> = {}) =>
      send("PATCH", location, { "Upload-Offset": String(offset), "Content-Type": "application/offset+octet-stream", ...extra }, bytes) as Promise<TusAnswer<T>>,
    /** DELETE (§Termination). */
    terminate: (location: string) => send("DELETE", location, {}),
  };
}
