import fs from "node:fs";
import path from "node:path";
import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

// The layer and cycle rules of eslint.config.mjs, checked on deliberately wrong imports: each
// snippet is written as a scratch file at the given place in the tree, linted, and removed.
const ROOT = path.resolve(import.meta.dirname, "../..");
const eslint = new ESLint({ cwd: ROOT });
const RULES = new Set(["import/no-restricted-paths", "import/no-cycle"]);

async function lintScratch(files: Record<string, string>): Promise<string[]> {
  const written = Object.entries(files).map(([file, code]) => {
    const full = path.join(ROOT, file);
    fs.writeFileSync(full, code);
    return full;
  });
  try {
    const results = await eslint.lintFiles(written);
    return results.flatMap((r) => r.messages.filter((m) => m.ruleId && RULES.has(m.ruleId)).map((m) => `${m.ruleId}: ${m.message}`));
  } finally {
    for (const f of written) fs.rmSync(f, { force: true });
  }
}

const scratch = (dir: string) => `${dir}/lint-scratch-${process.pid}.ts`;
const layerErrors = (dir: string, code: string) => lintScratch({ [scratch(dir)]: code });

describe("one-way layers", { timeout: 120_000 }, () => {
  it("refuses pure lib code importing the server layer or the database", async () => {
    expect(await layerErrors("lib/geometry", 'import { env } from "@/server/env";\nexport const x = env;\n')).toHaveLength(1);
    expect(await layerErrors("lib/geometry", 'import { users } from "@/db/schema";\nexport const x = users;\n')).toHaveLength(1);
  });

  it("refuses db/ importing the server layer, and UI components importing server or db", async () => {
    expect(await layerErrors("db", 'import { env } from "@/server/env";\nexport const x = env;\n')).toHaveLength(1);
    expect(await layerErrors("components/ui", 'import type { Db } from "@/server/access/context";\nexport type X = Db;\n')).toHaveLength(1);
    expect(await layerErrors("components/ui", 'import { users } from "@/db/schema";\nexport const x = users;\n')).toHaveLength(1);
  });

  it("refuses data access importing rendering, and the server layer importing pages", async () => {
    expect(
      await layerErrors(
        "server/access",
        'import { renderAnnotatedPngBuffer } from "@/server/images/render-png";\nexport const x = renderAnnotatedPngBuffer;\n',
      ),
    ).toHaveLength(1);
    expect(await layerErrors("server", 'import { GET } from "@/app/api/health/route";\nexport const x = GET;\n')).toHaveLength(1);
  });

  it("lets each layer import the ones below it", async () => {
    expect(
      await layerErrors("server", 'import { users } from "@/db/schema";\nimport { AppError } from "@/lib/errors";\nexport const x = [users, AppError];\n'),
    ).toEqual([]);
    expect(await layerErrors("components/ui", 'import type { DieDto } from "@/lib/dto/dies";\nexport type X = DieDto;\n')).toEqual([]);
    expect(await layerErrors("db", 'import { ROLES } from "@/lib/dto/stored-values";\nexport const x = ROLES;\n')).toEqual([]);
  });

  it("refuses an import cycle", async () => {
    const errors = await lintScratch({
      "lib/geometry/lint-scratch-cycle-a.ts": 'import { b } from "./lint-scratch-cycle-b";\nexport const a = () => b;\n',
      "lib/geometry/lint-scratch-cycle-b.ts": 'import { a } from "./lint-scratch-cycle-a";\nexport const b = () => a;\n',
    });
    expect(errors.filter((e) => e.startsWith("import/no-cycle"))).toHaveLength(2);
  });
});
