// Upload benchmark: the real server's RSS growth while it receives a 2 GB multipart upload,
// streamed from this process so neither side holds the file in memory.
import fs from "node:fs";
import http from "node:http";
import { startServer } from "../../tests/support/server";
import { demoClients } from "../../tests/support/client";

function rssMb(pid: number): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${pid}/status`, "utf8"));
  return m ? Number(m[1]) / 1024 : 0;
}

/** Prints the server's RSS growth for a 2 GB upload (target < 200 MB). */
export async function benchUpload(totalBytes = 2 * 1024 ** 3) {
  const server = await startServer({ env: { KERFLINE_SEED: "demo-records" } });
  try {
    const { analyst } = await demoClients(server.url);
    const teamId = (await analyst.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
    const c = await analyst.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Upload bench" });
    const d = await analyst.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "bench die" });
    const cookie = (analyst as unknown as { cookieHeader(): string }).cookieHeader();
    const pid = server.proc.pid!;
    // Warm the route (compiles and loads its modules) before taking the baseline.
    await analyst.upload(`/api/dies/${d.body.id}/micrographs`, new FormData());
    await new Promise((r) => setTimeout(r, 500));
    const baseline = rssMb(pid);
    let peak = baseline;
    const sampler = setInterval(() => (peak = Math.max(peak, rssMb(pid))), 50);
    const boundary = "----kerflinebench";
    const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`);
    const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
    const chunk = Buffer.alloc(1024 * 1024, 0x55);
    // Only the first chunk carries a JPEG signature (a separate buffer: writes keep a reference).
    const first = Buffer.from(chunk);
    first.set([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x01, 0x00, 0x00, 0x01], 0);
    const t0 = performance.now();
    const status = await new Promise<number>((resolve, reject) => {
      const req = http.request(
        `${server.url}/api/dies/${d.body.id}/micrographs`,
        {
          method: "POST",
          headers: { cookie, "content-type": `multipart/form-data; boundary=${boundary}`, "content-length": head.length + totalBytes + tail.length },
        },
        (res) => {
          res.resume();
          res.on("end", () => resolve(res.statusCode ?? 0));
        },
      );
      req.on("error", reject);
      let sent = 0;
      req.write(head);
      const pump = () => {
        while (sent < totalBytes) {
          const n = Math.min(chunk.length, totalBytes - sent);
          const body = sent === 0 ? first : chunk;
          const ok = req.write(n === chunk.length ? body : body.subarray(0, n));
          sent += n;
          if (!ok) return void req.once("drain", pump);
        }
        req.end(tail);
      };
      pump();
    });
    clearInterval(sampler);
    const seconds = (performance.now() - t0) / 1000;
    const growth = peak - baseline;
    console.log(
      `upload of ${(totalBytes / 1024 ** 3).toFixed(1)} GB to the running server (${seconds.toFixed(1)} s, ${(totalBytes / 1024 ** 2 / seconds).toFixed(0)} MB/s, answered ${status} — the body is not a whole JPEG, so it is refused after it is received):`,
    );
    console.log(
      `  server RSS baseline ${baseline.toFixed(0)} MB, peak ${peak.toFixed(0)} MB, growth ${growth.toFixed(0)} MB  (target < 200 MB) ${growth < 200 ? "MET" : "NOT MET"}`,
    );
  } finally {
    await server.stop();
  }
}
