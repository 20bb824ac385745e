import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { S3Client } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startFakeS3, type FakeS3 } from "../../tests/support/s3-fake";
import { localStore } from "./local-store";
import { PART_SIZE, s3Store } from "./s3-store";
import type { ObjectStore } from "./object-store";

/*
 * Both stores against the same checks. References: the bytes each test writes itself (a read
 * must return them, a range read exactly bytes start..end inclusive as in RFC 9110 §14.1.2),
 * SHA-256 of a file (node:crypto) for the multipart round trip, and s3rver — a separate
 * implementation of the S3 API — as the other side of the S3 store.
 */
async function text(s: NodeJS.ReadableStream | null): Promise<string> {
  if (!s) return "<null>";
  const parts: Buffer[] = [];
  for await (const c of s) parts.push(c as Buffer);
  return Buffer.concat(parts).toString("latin1");
}

const sha256 = (file: string) => crypto.createHash("sha256").update(fs.readFileSync(file)).digest("hex");

let work: string;
let fake: FakeS3;
let s3: S3Client;
const stores: Record<string, () => ObjectStore> = {};
const commands: string[] = [];

beforeAll(async () => {
  work = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-store-"));
  fake = await startFakeS3();
  s3 = new S3Client({
    endpoint: fake.endpoint,
    region: "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" },
  });
  s3.middlewareStack.add((next, context) => (args) => (commands.push(context.commandName ?? "?"), next(args)), { step: "initialize" });
  stores.local = () => localStore({ root: path.join(work, "root"), tempDir: path.join(work, "scratch") });
  stores.s3 = () => s3Store(s3, fake.bucket);
});
afterAll(async () => {
  s3?.destroy();
  await fake?.stop();
  fs.rmSync(work, { recursive: true, force: true });
});

describe.each(["local", "s3"])("%s object store", (kind) => {
  it("stores a buffer and a file, and reads them back whole and by range", async () => {
    const store = stores[kind]();
    const a = await store.putBuffer("tiles/d1/a.bin", Buffer.from("0123456789"), "application/octet-stream");
    expect(a.size).toBe(10);
    const src = path.join(work, `${kind}-src.txt`);
    fs.writeFileSync(src, "abcdefghij");
    await store.putFile("tiles/d1/sub/b.txt", src, "text/plain");
    expect(await text(await store.read("tiles/d1/a.bin"))).toBe("0123456789");
    expect(await text(await store.read("tiles/d1/a.bin", { start: 2, end: 4 }))).toBe("234");
    expect(await text(await store.read("tiles/d1/sub/b.txt", { start: 9, end: 9 }))).toBe("j");
    expect((await store.stat("tiles/d1/sub/b.txt"))?.size).toBe(10);
    expect(await store.read("tiles/d1/none")).toBeNull();
    expect(await store.stat("tiles/d1/none")).toBeNull();
  });

  it("gives a new ETag to a replaced object", async () => {
    const store = stores[kind]();
    const first = await store.putBuffer("tiles/d2/x", Buffer.from("first"));
    const second = await store.putBuffer("tiles/d2/x", Buffer.from("second!"));
    expect(first.etag).not.toBe(second.etag);
    expect((await store.stat("tiles/d2/x"))?.etag).toBe(second.etag);
    expect(await text(await store.read("tiles/d2/x"))).toBe("second!");
  });

  it("lists and removes by prefix, leaving other prefixes alone", async () => {
    const store = stores[kind]();
    for (const k of ["exports/d3/1.png", "exports/d3/2.png", "exports/d30/3.png", "tiles/d3/4.jpg"]) await store.putBuffer(k, Buffer.from(k));
    expect(await store.list("exports/d3/")).toEqual(["exports/d3/1.png", "exports/d3/2.png"]);
    await store.remove("exports/d3/1.png");
    await store.remove("exports/d3/never-there.png");
    expect(await store.list("exports/d3/")).toEqual(["exports/d3/2.png"]);
    await store.removePrefix("exports/d3/");
    expect(await store.list("exports/d3/")).toEqual([]);
    expect(await store.list("exports/d30/")).toEqual(["exports/d30/3.png"]);
    expect(await store.list("tiles/d3/")).toEqual(["tiles/d3/4.jpg"]);
    expect(await store.list("nothing/here/")).toEqual([]);
  });

  it("lists and removes more keys than one listing page holds (1000, S3 API reference)", async () => {
    const store = stores[kind]();
    const keys = Array.from({ length: 1003 }, (_, i) => `tiles/d8/${String(i).padStart(4, "0")}.jpg`);
    let next = 0;
    await Promise.all(
      Array.from({ length: 8 }, async () => {
        while (next < keys.length) await store.putBuffer(keys[next++], Buffer.from("t"));
      }),
    );
    expect(await store.list("tiles/d8/")).toEqual(keys);
    await store.removePrefix("tiles/d8/");
    expect(await store.list("tiles/d8/")).toEqual([]);
  });

  it("downloads an object to a local file", async () => {
    const store = stores[kind]();
    await store.putBuffer("originals/d4/o.bin", Buffer.from("original bytes"));
    const dest = path.join(work, `${kind}-download.bin`);
    await store.download("originals/d4/o.bin", dest);
    expect(fs.readFileSync(dest, "latin1")).toBe("original bytes");
  });

  it("refuses keys that could leave the store", async () => {
    const store = stores[kind]();
    for (const bad of ["../x", "a/../../x", "/abs", "a//b", "a/.hidden/../x", ""]) {
      await expect(store.putBuffer(bad, Buffer.from("x"))).rejects.toThrow(/not a storage key/);
    }
    await expect(store.removePrefix("tiles")).rejects.toThrow(/ends with/);
  });

  it("stores a file larger than one part (multipart on S3) with the same SHA-256", async () => {
    const store = stores[kind]();
    commands.length = 0;
    const big = path.join(work, `${kind}-big.bin`);
    fs.writeFileSync(big, crypto.randomBytes(PART_SIZE * 2 + 12345));
    const put = await store.putFile("originals/d5/big.bin", big);
    expect(put.size).toBe(PART_SIZE * 2 + 12345);
    // The S3 API's own multipart sequence (S3 API reference: CreateMultipartUpload, UploadPart
    // per part, CompleteMultipartUpload), as the client sent it.
    if (kind === "s3") expect(commands.filter((c) => c.includes("Multipart") || c === "UploadPartCommand")).toEqual(["CreateMultipartUploadCommand", "UploadPartCommand", "UploadPartCommand", "UploadPartCommand", "CompleteMultipartUploadCommand"]);
    const back = path.join(work, `${kind}-big-back.bin`);
    await store.download("originals/d5/big.bin", back);
    expect(sha256(back)).toBe(sha256(big));
    expect(await text(await store.read("originals/d5/big.bin", { start: PART_SIZE - 2, end: PART_SIZE + 1 }))).toBe(
      fs.readFileSync(big).subarray(PART_SIZE - 2, PART_SIZE + 2).toString("latin1"),
    );
  });
});

describe("local object store", () => {
  it("leaves nothing in the store folder when a put fails", async () => {
    const root = path.join(work, "failing-root");
    const store = localStore({ root, tempDir: path.join(work, "failing-scratch") });
    await expect(store.putFile("tiles/d6/x.jpg", path.join(work, "does-not-exist"))).rejects.toThrow();
    expect(fs.existsSync(path.join(root, "tiles", "d6", "x.jpg"))).toBe(false);
    expect(fs.readdirSync(path.join(work, "failing-scratch"))).toEqual([]);
  });
});

describe("S3 object store", () => {
  it("creates a missing bucket at start, and accepts an existing one", async () => {
    const store = s3Store(s3, "kerfline-made-at-start");
    await store.ensureBucket();
    await store.ensureBucket();
    await store.putBuffer("tiles/d7/x", Buffer.from("x"));
    expect(await store.list("tiles/d7/")).toEqual(["tiles/d7/x"]);
  });
});
