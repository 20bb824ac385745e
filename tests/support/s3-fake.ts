import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

// s3rver: a small S3-compatible server on local disk, the local fake of the S3 API for tests
// and development (its default credentials are S3RVER / S3RVER). It runs in a child process
// (s3-fake-server.ts) so it can have the legacy OpenSSL provider its listing pages need.
export type FakeS3 = { endpoint: string; bucket: string; env: Record<string, string>; dir: string; stop(): Promise<void> };

/** Starts s3rver on a free port with one bucket; `env` is the configuration contract's S3 part. */
export async function startFakeS3(bucket = "kerfline-test"): Promise<FakeS3> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-s3-"));
  const child = spawn(process.execPath, ["--openssl-legacy-provider", "--import", "tsx", path.join(import.meta.dirname, "s3-fake-server.ts"), dir, bucket], {
    stdio: ["ignore", "pipe", "pipe"],
  });
  let err = "";
  child.stderr!.on("data", (d) => (err += d));
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  const port = await new Promise<number>((resolve, reject) => {
    let out = "";
    child.stdout!.on("data", (d) => {
      out += d;
      const line = out.split("\n").find((l) => l.startsWith("{"));
      if (line) resolve((JSON.parse(line) as { port: number }).port);
    });
    child.once("exit", (code) => reject(new Error(`s3rver exited with code ${code}:\n${err}`)));
  });
  const endpoint = `http://127.0.0.1:${port}`;
  return {
    endpoint,
    bucket,
    dir,
    env: {
      KERFLINE_STORAGE: "s3",
      S3_ENDPOINT: endpoint,
      S3_BUCKET: bucket,
      S3_REGION: "us-east-1",
      S3_FORCE_PATH_STYLE: "1",
      AWS_ACCESS_KEY_ID: "S3RVER",
      AWS_SECRET_ACCESS_KEY: "S3RVER",
    },
    async stop() {
      if (child.exitCode === null) {
        child.kill("SIGTERM");
        await exited;
      }
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
