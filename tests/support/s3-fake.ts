import fs from "node:fs";
import os from "node:os";
import path from "node:path";
// s3rver: a small S3-compatible server on local disk, the local fake of the S3 API for tests
// and development (its default credentials are S3RVER / S3RVER).
import S3rver from "s3rver";
import { addMultipartListing } from "./s3-fake-multipart";

export type FakeS3 = { endpoint: string; bucket: string; env: Record<string, string>; dir: string; stop(): Promise<void> };

/** Starts s3rver on a free port with one bucket; `env` is the configuration contract's S3 part. */
export async function startFakeS3(bucket = "kerfline-test"): Promise<FakeS3> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-s3-"));
  const server = new S3rver({ port: 0, address: "127.0.0.1", silent: true, directory: dir, configureBuckets: [{ name: bucket, configs: [] }] });
  addMultipartListing(server as unknown as Parameters<typeof addMultipartListing>[0], dir);
  const { port } = (await server.run()) as { port: number };
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
      await server.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
