import fs from "node:fs";
import path from "node:path";

// s3rver implements CreateMultipartUpload, UploadPart and CompleteMultipartUpload but not
// ListParts or AbortMultipartUpload, which a resumable upload store needs to tell the offset
// and to abandon an upload. These two are added here from the S3 API reference (ListParts:
// GET /{Key}?uploadId=…, a ListPartsResult document; AbortMultipartUpload: DELETE
// /{Key}?uploadId=…, 204; NoSuchUpload 404 for an unknown id), over s3rver's own part files.
type Ctx = {
  method: string;
  path: string;
  query: Record<string, string | undefined>;
  status: number;
  type: string;
  body: unknown;
  set(name: string, value: string): void;
};
type Middleware = (ctx: Ctx, next: () => Promise<void>) => Promise<void> | void;

const xml = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/** Adds ListParts and AbortMultipartUpload to an s3rver instance before it runs. */
export function addMultipartListing(server: { middleware: Middleware[] }, directory: string) {
  const listing: Middleware = async (ctx, next) => {
    const uploadId = ctx.query.uploadId;
    const match = /^\/([^/]+)\/(.+)$/.exec(ctx.path);
    if (!uploadId || !match || (ctx.method !== "GET" && ctx.method !== "DELETE")) return next();
    const [, bucket, key] = match;
    const dir = path.join(directory, bucket, "._S3rver_uploads", path.basename(uploadId));
    if (!fs.existsSync(dir)) {
      ctx.status = 404;
      ctx.type = "application/xml";
      ctx.body = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>NoSuchUpload</Code><Message>The specified upload does not exist.</Message></Error>`;
      return;
    }
    if (ctx.method === "DELETE") {
      fs.rmSync(dir, { recursive: true, force: true });
      ctx.status = 204;
      ctx.body = "";
      return;
    }
    const parts = fs
      .readdirSync(dir)
      .filter((n) => /^\d+$/.test(n))
      .map(Number)
      .sort((a, b) => a - b)
      .map((n) => {
        const size = fs.statSync(path.join(dir, String(n))).size;
        const md5 = fs.readFileSync(path.join(dir, `${n}.md5`), "utf8");
        return `<Part><PartNumber>${n}</PartNumber><ETag>"${md5}"</ETag><Size>${size}</Size></Part>`;
      });
    ctx.status = 200;
    ctx.type = "application/xml";
    ctx.body =
      `<?xml version="1.0" encoding="UTF-8"?>\n<ListPartsResult xmlns="http://s3.amazonaws.com/doc/2006-03-01/">` +
      `<Bucket>${xml(bucket)}</Bucket><Key>${xml(decodeURIComponent(key))}</Key><UploadId>${xml(uploadId)}</UploadId>` +
      `<IsTruncated>false</IsTruncated>${parts.join("")}</ListPartsResult>`;
  };
  // Just before s3rver's router (the last middleware), after its store and path handling.
  server.middleware.splice(server.middleware.length - 1, 0, listing);
}
