// Environment for every Kerfline server process, shared by `npm start`, `npm run dev` and the
// test harnesses: the auth secret is made once and kept in the data dir (so a fresh machine
// needs no set-up), and the proxy reads it from AUTH_SECRET like the rest of Auth.js.
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";

export function serverEnv(base = process.env) {
  const dataDir = path.resolve(base.KERFLINE_DATA_DIR || "./storage");
  fs.mkdirSync(dataDir, { recursive: true });
  let secret = base.AUTH_SECRET;
  if (!secret) {
    const file = path.join(dataDir, "auth-secret");
    if (!fs.existsSync(file)) {
      try {
        fs.writeFileSync(file, crypto.randomBytes(32).toString("base64url"), { flag: "wx", mode: 0o600 });
      } catch {
        /* written by a concurrent start */
      }
    }
    secret = fs.readFileSync(file, "utf8").trim();
  }
  return {
    ...base,
    KERFLINE_DATA_DIR: dataDir,
    AUTH_SECRET: secret,
    AUTH_TRUST_HOST: "true",
    NEXT_TELEMETRY_DISABLED: "1",
  };
}
