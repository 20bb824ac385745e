// Child process of startFakeS3: s3rver on a free port, printing its port once listening.
// Run with --openssl-legacy-provider: s3rver's ListObjectsV2 continuation tokens use DES, which
// Node's OpenSSL 3 refuses otherwise (a listing of more than 1000 keys would answer 500).
import S3rver from "s3rver";
import { addMultipartListing } from "./s3-fake-multipart";

const [dir, bucket] = process.argv.slice(2);
const server = new S3rver({ port: 0, address: "127.0.0.1", silent: true, directory: dir, configureBuckets: [{ name: bucket, configs: [] }] });
// s3rver lacks ListParts and AbortMultipartUpload, which the tus S3 store needs.
addMultipartListing(server as unknown as Parameters<typeof addMultipartListing>[0], dir);
const { port } = (await server.run()) as { port: number };
process.stdout.write(`${JSON.stringify({ port })}\n`);
process.on("SIGTERM", () => server.close().then(() => process.exit(0)));
