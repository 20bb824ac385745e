import fs from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

// Kerfline speaks of remarks and checks (drawn → checked → signed off), not of a code-review
// site's threads and approvals; this reads every string people can see and fails on the old words.
const ROOT = path.resolve(import.meta.dirname, "../..");

/** The old wording, each matched as whole words, any case. */
const OLD_PHRASES = [
  "Submit for review",
  "submitted for review",
  "Request changes",
  "Changes requested",
  "requested changes",
  "In review",
  "Approve",
  "Approved",
  "Resolve",
  "Resolved",
  "Start a thread",
  "Start thread",
  "New thread",
  "review thread",
  "thread",
  "threads",
  "Swipe",
  "Blend",
  "Layers",
  "Inspect",
  "Inspector",
];

/**
 * Strings that contain an old word but are code, never shown: each with the reason. A literal is
 * allowed when it equals `exact` or matches `pattern`.
 */
const ALLOWED: readonly { exact?: string; pattern?: RegExp; why: string }[] = [
  { exact: "resolved", why: "the stored status of a closed remark (lib/dto/stored-values.ts)" },
  { exact: "resolve", why: "the API's path segment POST /api/threads/:id/resolve" },
  { exact: "thread", why: "the deep link's search param ?thread=" },
  { exact: "threads", why: "the export request's field (API), as the form registers it" },
  { pattern: /^\/api\/(dies\/[^/]*\/)?threads\b/, why: "API paths under /threads stay as they are" },
  { pattern: /^\/threads\b/, why: "the rest of an API path after an id: `/api/dies/${id}/threads`" },
  { pattern: /^\?thread=$/, why: "the deep link's search param, before its value" },
  { pattern: /^(thread|review)\.[a-z_]+$/, why: "audit action codes (keys of lib/review/activity-words.ts)" },
];

/** Files whose strings are read by people: components and pages, mail, inbox and PDF text, export drawing. */
function sourceFiles(): string[] {
  const walk = (dir: string, keep: (f: string) => boolean): string[] =>
    (fs.readdirSync(path.join(ROOT, dir), { recursive: true }) as string[]).map((f) => path.join(dir, f)).filter(keep);
  const notTest = (f: string) => !/\.test\.tsx?$/.test(f);
  return [
    ...walk("components", (f) => /\.tsx?$/.test(f) && notTest(f)),
    ...walk("app", (f) => f.endsWith(".tsx")),
    "lib/review/mail-templates.ts",
    "lib/review/inbox-text.ts",
    "lib/review/activity-words.ts",
    ...walk("lib/export", (f) => f.endsWith(".ts") && notTest(f)),
  ];
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
const OLD = OLD_PHRASES.map((p) => ({ phrase: p, re: new RegExp(`(^|[^A-Za-z])${escape(p).replace(/ /g, "\\s+")}(?![A-Za-z])`, "i") }));
const allowed = (text: string) => ALLOWED.some((a) => a.exact === text || (a.pattern && a.pattern.test(text)));
const oldIn = (text: string) => (allowed(text.trim()) ? [] : OLD.filter((o) => o.re.test(text)).map((o) => o.phrase));

/** Is the literal code rather than text: a type, an import path, a property name, a compared value? */
function isCodePosition(node: ts.Node): boolean {
  const p = node.parent;
  if (ts.isLiteralTypeNode(p) || ts.isImportDeclaration(p) || ts.isExportDeclaration(p) || ts.isExternalModuleReference(p)) return true;
  if ((ts.isPropertyAssignment(p) || ts.isPropertySignature(p)) && p.name === node) return true;
  if (ts.isElementAccessExpression(p) && p.argumentExpression === node) return true;
  if (ts.isBinaryExpression(p) && [ts.SyntaxKind.EqualsEqualsEqualsToken, ts.SyntaxKind.ExclamationEqualsEqualsToken].includes(p.operatorToken.kind))
    return true;
  if (ts.isCaseClause(p)) return true;
  if (ts.isJsxAttribute(p) && ["className", "data-testid", "key", "id", "htmlFor"].includes(p.name.getText())) return true;
  return false;
}

/** The expression a literal or template part belongs to (a template's parts stand for the whole template). */
const expressionOf = (node: ts.Node): ts.Node =>
  ts.isTemplateSpan(node.parent) ? node.parent.parent : ts.isTemplateExpression(node.parent) ? node.parent : node;

/** Every old phrase in a file's strings and JSX text, as `file:line: "text" (phrase)`. */
function findingsIn(file: string, code = fs.readFileSync(path.join(ROOT, file), "utf8")): string[] {
  const src = ts.createSourceFile(file, code, ts.ScriptTarget.Latest, true, file.endsWith(".tsx") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  const out: string[] = [];
  const visit = (node: ts.Node) => {
    const literal =
      ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node) || ts.isTemplateHead(node) || ts.isTemplateMiddle(node) || ts.isTemplateTail(node);
    if ((literal && !isCodePosition(expressionOf(node))) || ts.isJsxText(node)) {
      const text = (node as ts.LiteralLikeNode).text ?? node.getText();
      for (const phrase of oldIn(text))
        out.push(`${file}:${src.getLineAndCharacterOfPosition(node.getStart()).line + 1}: ${JSON.stringify(text.trim())} (${phrase})`);
    }
    ts.forEachChild(node, visit);
  };
  visit(src);
  return out;
}

/** Prerendered pages of a build: HTML with its scripts and tags removed, and RSC payloads as they are. */
function builtTexts(): { file: string; text: string }[] | null {
  const dir = path.join(ROOT, ".next/server/app");
  if (!fs.existsSync(dir)) return null;
  return (fs.readdirSync(dir, { recursive: true }) as string[])
    .filter((f) => /\.(html|rsc|body)$/.test(f))
    .map((f) => {
      const raw = fs.readFileSync(path.join(dir, f), "utf8");
      const text = f.endsWith(".html") ? raw.replace(/<script[\s\S]*?<\/script>/g, " ").replace(/<[^>]+>/g, " ") : raw;
      return { file: `.next/server/app/${f}`, text };
    });
}

describe("no code-review wording left", () => {
  it("finds the old words where they are planted, and lets the allowed code values through", () => {
    expect(oldIn("Submit for review")).toEqual(["Submit for review"]);
    expect(oldIn("Resolve thread")).toEqual(["Resolve", "thread"]);
    expect(oldIn("← All threads")).toEqual(["threads"]);
    expect(oldIn("Close remark")).toEqual([]);
    expect(oldIn("resolved")).toEqual([]);
    expect(oldIn("/api/threads/")).toEqual([]);
    expect(oldIn("inspection of the die")).toEqual([]);
  });

  it("reads JSX text, attributes and template text, and skips compared values, types and keys", () => {
    const code = `type S = "resolved" | "open";
const L = { resolved: "x", "thread.created": "raised" };
export const A = ({ s }: { s: S }) => (
  <section aria-label="Swipe divider">
    {s === "resolved" ? "Closed" : "Open"}
    <button title={\`Approve \${s}\`}>Resolve thread</button>
  </section>
);`;
    expect(findingsIn("scratch.tsx", code).map((f) => f.replace(/^scratch\.tsx:\d+: /, ""))).toEqual([
      '"Swipe divider" (Swipe)',
      '"Approve" (Approve)',
      '"Resolve thread" (Resolve)',
      '"Resolve thread" (thread)',
    ]);
  });

  it("shows none of them in components, pages, mail, inbox, activity or export text", () => {
    const findings = sourceFiles().flatMap((f) => findingsIn(f));
    expect(findings).toEqual([]);
  });

  it("shows none of them in the built app's prerendered pages", (ctx) => {
    const texts = builtTexts();
    if (!texts) {
      ctx.skip("no build in .next/server/app: run `node scripts/build-if-stale.mjs` to check the built pages too");
      return;
    }
    const findings = texts.flatMap(({ file, text }) => OLD.filter((o) => o.re.test(text)).map((o) => `${file} (${o.phrase})`));
    expect(findings).toEqual([]);
  });
});
