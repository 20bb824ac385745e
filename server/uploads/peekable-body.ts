import "server-only";

/**
 * A request body whose first bytes can be read before the tus handler streams it to the store,
 * so a file that is not an image is refused when its first chunk arrives, not after the last.
 * Peeked bytes are buffered and handed on first; nothing is read twice or lost.
 */
export class PeekableBody {
  private readonly reader: ReadableStreamDefaultReader<Uint8Array>;
  private readonly buffered: Uint8Array[] = [];
  private ended = false;
  private controller: ReadableStreamDefaultController<Uint8Array> | null = null;

  constructor(source: ReadableStream<Uint8Array>) {
    this.reader = source.getReader();
  }

  /** Up to `n` leading bytes (fewer only when the body is shorter). */
  async peek(n: number): Promise<Buffer> {
    let size = this.buffered.reduce((s, b) => s + b.byteLength, 0);
    while (size < n && !this.ended) {
      const { done, value } = await this.reader.read();
      if (done) this.ended = true;
      else {
        this.buffered.push(value);
        size += value.byteLength;
      }
    }
    return Buffer.concat(this.buffered).subarray(0, n);
  }

  /** The whole body, peeked bytes first; a client that drops the connection errors it. */
  stream(): ReadableStream<Uint8Array> {
    return new ReadableStream<Uint8Array>(
      {
        start: (controller) => {
          this.controller = controller;
        },
        pull: async (controller) => {
          const next = this.buffered.shift();
          if (next) return controller.enqueue(next);
          if (this.ended) return controller.close();
          const { done, value } = await this.reader.read();
          if (done) controller.close();
          else controller.enqueue(value);
        },
        cancel: (reason) => this.reader.cancel(reason),
      },
      // No read-ahead: with the default high-water mark the stream pulls a chunk as soon as it
      // is made, and a peek after that would see the second chunk, not the first.
      { highWaterMark: 0 },
    );
  }

  /** The client went away: fail the body now rather than wait for bytes that never come. */
  abort(): void {
    try {
      this.controller?.error(new Error("The upload was interrupted by the client."));
    } catch {
      /* already closed: the whole body had arrived */
    }
    void this.reader.cancel().catch(() => undefined);
  }
}
