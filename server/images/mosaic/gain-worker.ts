import "server-only";
import { Worker } from "node:worker_threads";

/**
 * Shading correction of whole frames on a second thread, so that it runs beside the
 * registration instead of after it (it touches every sample of every frame). The worker's
 * code is a plain script given as a string: it needs no module resolution, so it runs the
 * same under Next's server bundle, tsx and vitest. Pixels and gains live in shared memory.
 */
const SOURCE = `
const { parentPort, workerData } = require("node:worker_threads");
const gain = new Uint16Array(workerData.gain);
const shift = workerData.shift;
const half = 1 << (shift - 1);
parentPort.on("message", ({ id, pixels, length }) => {
  const px = new Uint8Array(pixels, 0, length);
  for (let i = 0; i < length; i++) {
    const v = (px[i] * gain[i] + half) >> shift;
    px[i] = v > 255 ? 255 : v;
  }
  parentPort.postMessage(id);
});
`;

export type GainWorker = {
  /** Multiplies the samples of `pixels` (shared memory) by the gain, in place. */
  apply(pixels: SharedArrayBuffer, length: number): Promise<void>;
  close(): Promise<void>;
};

/** Starts the worker for a gain held in shared memory (fixed point, `shift` fraction bits). */
export function startGainWorker(gain: SharedArrayBuffer, shift: number): GainWorker {
  const worker = new Worker(SOURCE, { eval: true, workerData: { gain, shift } });
  const waiting = new Map<number, { resolve: () => void; reject: (e: Error) => void }>();
  let next = 0;
  const failAll = (err: Error) => {
    for (const w of waiting.values()) w.reject(err);
    waiting.clear();
  };
  worker.on("message", (id: number) => {
    waiting.get(id)?.resolve();
    waiting.delete(id);
  });
  worker.on("error", failAll);
  worker.on("exit", (code) => failAll(new Error(`shading worker stopped (exit code ${code})`)));
  return {
    apply(pixels, length) {
      const id = next++;
      return new Promise<void>((resolve, reject) => {
        waiting.set(id, { resolve, reject });
        worker.postMessage({ id, pixels, length });
      });
    },
    async close() {
      await worker.terminate();
    },
  };
}
