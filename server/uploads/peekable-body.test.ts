import { describe, expect, it } from "vitest";
import { PeekableBody } from "./peekable-body";
import { detectRasterFormat } from "@/lib/tiles/magic-bytes";

const streamOf = (...parts: string[]) =>
  new ReadableStream<Uint8Array>({
    start(c) {
      for (const p of parts) c.enqueue(new TextEncoder().encode(p));
      c.close();
    },
  });

async function readAll(s: ReadableStream<Uint8Array>): Promise<string> {
  return new Response(s).text();
}

describe("PeekableBody", () => {
  it("peeks across chunks and then hands on every byte once, in order", async () => {
    const body = new PeekableBody(streamOf("<!do", "ctype html>", " rest of the page"));
    // The route makes the outgoing stream before the hook peeks: it must not read ahead.
    const out = body.stream();
    await new Promise((r) => setTimeout(r, 10));
    const head = await body.peek(16);
    // Ground truth: the first 16 characters of the concatenated parts.
    expect(head.toString()).toBe("<!doctype html> ");
    expect(detectRasterFormat(head)).toBeNull();
    expect(await readAll(out)).toBe("<!doctype html> rest of the page");
  });

  it("returns fewer bytes when the body is shorter", async () => {
    const body = new PeekableBody(streamOf("abc"));
    expect((await body.peek(16)).toString()).toBe("abc");
    expect(await readAll(body.stream())).toBe("abc");
  });
});
