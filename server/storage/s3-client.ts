import "server-only";
import { S3Client } from "@aws-sdk/client-s3";
import { env } from "../env";

/** The S3 settings of the configuration contract (README), validated by env(). */
export function s3Settings() {
  const e = env();
  return {
    bucket: e.S3_BUCKET!,
    client: {
      endpoint: e.S3_ENDPOINT,
      region: e.S3_REGION,
      forcePathStyle: e.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: e.AWS_ACCESS_KEY_ID!, secretAccessKey: e.AWS_SECRET_ACCESS_KEY! },
    },
  };
}

const g = globalThis as unknown as { __kerflineS3?: S3Client };

/** The process's one S3 client (it pools its HTTP connections). */
export function s3Client(): S3Client {
  g.__kerflineS3 ??= new S3Client(s3Settings().client);
  return g.__kerflineS3;
}
