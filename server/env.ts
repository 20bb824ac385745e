import "server-only";
import { z } from "zod";
import path from "node:path";
import fs from "node:fs";
import crypto from "node:crypto";

/**
 * The one module that reads process.env. Everything else asks `env()`.
 * Validated once, lazily, so that importing it at build time has no side effects.
 */
const optionalText = z
  .string()
  .optional()
  .or(z.literal("").transform(() => undefined));

const schema = z
  .object({
    NODE_ENV: z.enum(["development", "production", "test"]).default("production"),
    KERFLINE_DATA_DIR: z.string().min(1).default("./storage"),
    PORT: z.coerce.number().int().min(1).max(65535).default(3000),
    AUTH_SECRET: z.string().min(16).optional(),
    DATABASE_URL: z
      .string()
      .regex(/^postgres(ql)?:\/\//, "DATABASE_URL must be a postgres:// URL")
      .optional()
      .or(z.literal("").transform(() => undefined)),
    SMTP_URL: z
      .string()
      .optional()
      .or(z.literal("").transform(() => undefined)),
    /** Port of the local fake mail server (only when SMTP_URL is unset); 0 = any free port. */
    KERFLINE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
    /** First retry delay of the mail outbox; later ones double (tests shorten it). */
    KERFLINE_MAIL_RETRY_MS: z.coerce.number().int().positive().default(30_000),
    /** How often the outbox sender looks for due mail. */
    KERFLINE_MAIL_POLL_MS: z.coerce.number().int().positive().default(2_000),
    /** How long an invitation link stays valid (7 days unless a test shortens it). */
    KERFLINE_INVITATION_TTL_SECONDS: z.coerce
      .number()
      .int()
      .positive()
      .default(7 * 24 * 3600),
    /** The origin people reach the app at; used for links in mail and IIIF ids. */
    KERFLINE_PUBLIC_URL: z
      .string()
      .url()
      .optional()
      .or(z.literal("").transform(() => undefined)),
    /** 1: trust X-Forwarded-Host/-Proto (and Host) from a reverse proxy in front of the app. */
    KERFLINE_TRUST_PROXY: z
      .enum(["0", "1", ""])
      .default("0")
      .transform((v) => v === "1"),
    /** demo: records and rendered micrographs; demo-records: records only (fast test servers); none. */
    KERFLINE_SEED: z.enum(["demo", "demo-records", "none"]).default("demo"),
    KERFLINE_MAX_UPLOAD_BYTES: z.coerce
      .number()
      .int()
      .positive()
      .default(8 * 1024 ** 3),
    KERFLINE_MAX_PIXELS: z.coerce.number().int().positive().default(2_500_000_000),
    /** Exports one person may have queued or rendering at once (429 beyond). */
    KERFLINE_EXPORTS_PENDING_PER_USER: z.coerce.number().int().positive().default(10),
    /** Exports one die may have queued or rendering at once, whoever asked (429 beyond). */
    KERFLINE_EXPORTS_PENDING_PER_DIE: z.coerce.number().int().positive().default(20),
    /** Finished exports (file and record) are deleted this many hours after they finished. */
    KERFLINE_EXPORT_TTL_HOURS: z.coerce
      .number()
      .positive()
      .default(7 * 24),
    /** Where originals, pyramids, previews, thumbnails and exports live: the data dir or an S3-compatible bucket. */
    KERFLINE_STORAGE: z.enum(["local", "s3"]).default("local"),
    S3_ENDPOINT: optionalText.pipe(z.string().url("S3_ENDPOINT must be a URL such as http://127.0.0.1:4568").optional()),
    S3_BUCKET: optionalText,
    S3_REGION: z.string().min(1).default("us-east-1"),
    /** 1: bucket in the path (http://host/bucket/key), as most self-hosted S3-compatible stores need. */
    S3_FORCE_PATH_STYLE: z
      .enum(["0", "1", ""])
      .default("0")
      .transform((v) => v === "1"),
    AWS_ACCESS_KEY_ID: optionalText,
    AWS_SECRET_ACCESS_KEY: optionalText,
    /** on: this process runs job workers (the embedded default); off: a web server only (`npm run worker` runs them). */
    KERFLINE_JOBS: z.enum(["on", "off"]).default("on"),
    /** Jobs one worker process runs at once, per kind that uses the cores (tiling); default: one per core. */
    KERFLINE_WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(64).optional(),
    /** A running job without a heartbeat this long lost its worker and is retried elsewhere (tests shorten it). */
    KERFLINE_JOB_STALE_SECONDS: z.coerce.number().int().min(6).default(60),
    /** A resumable upload untouched this long is removed with its bytes. */
    KERFLINE_UPLOAD_EXPIRY_HOURS: z.coerce.number().positive().default(24),
  })
  .superRefine((v, ctx) => {
    if (v.KERFLINE_STORAGE !== "s3") return;
    for (const name of ["S3_BUCKET", "AWS_ACCESS_KEY_ID", "AWS_SECRET_ACCESS_KEY"] as const) {
      if (!v[name]) ctx.addIssue({ code: "custom", path: [name], message: `${name} is required when KERFLINE_STORAGE=s3` });
    }
  });

export type Env = z.infer<typeof schema> & { dataDir: string };

let cached: Env | undefined;

/** Validated configuration; throws a readable error on bad settings. */
export function env(): Env {
  if (cached) return cached;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Kerfline configuration is invalid:\n${lines.join("\n")}`);
  }
  cached = { ...parsed.data, dataDir: path.resolve(parsed.data.KERFLINE_DATA_DIR) };
  return cached;
}

/** A folder under the data dir, created on first use. */
export function dataPath(...parts: string[]): string {
  const p = path.join(/*turbopackIgnore: true*/ env().dataDir, ...parts);
  fs.mkdirSync(path.dirname(p), { recursive: true });
  return p;
}

/**
 * AUTH_SECRET from the environment, or one generated on first start and kept in the data
 * dir, so a fresh machine needs no set-up.
 */
export function authSecret(): string {
  const fromEnv = env().AUTH_SECRET;
  if (fromEnv) return fromEnv;
  const file = dataPath("auth-secret");
  try {
    return fs.readFileSync(file, "utf8").trim();
  } catch {
    const secret = crypto.randomBytes(32).toString("base64url");
    try {
      fs.writeFileSync(file, secret, { flag: "wx", mode: 0o600 });
      return secret;
    } catch {
      // Another process wrote it first: use theirs.
      return fs.readFileSync(file, "utf8").trim();
    }
  }
}
