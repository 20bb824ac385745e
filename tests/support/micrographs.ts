import type { ApiClient } from "./client";

/** Polls a micrograph until it reaches `status` (or fails), returning its last state. */
export async function waitForStatus(client: ApiClient, id: string, status: "ready" | "failed" | "tiling", timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await client.get<Record<string, unknown> & { status: string; error?: string; progress: number }>(`/api/micrographs/${id}`);
    if (res.body.status === status) return res.body;
    if (res.body.status === "failed" && status !== "failed") throw new Error(`micrograph failed: ${res.body.error}`);
    if (Date.now() > deadline) throw new Error(`micrograph still ${res.body.status} (${res.body.progress} %)`);
    await new Promise((r) => setTimeout(r, 200));
  }
}
