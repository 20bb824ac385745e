/**
 * Text that PostgreSQL cannot store or that is not well-formed Unicode: a NUL character
 * (PostgreSQL text and jsonb refuse U+0000) or a lone UTF-16 surrogate (a JSON escape such as
 * "\ud800" without its pair; not a Unicode scalar value, so it has no UTF-8 form).
 */
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

export type UnsafeText = { path: string; problem: string };

function problemOf(s: string): string | null {
  if (s.includes("\u0000")) return "contains a NUL character";
  if (LONE_SURROGATE.test(s)) return "contains a lone surrogate (not valid Unicode text)";
  return null;
}

/** The first string in a parsed JSON value that cannot be stored, with its path ("features.3.properties.text"). */
export function findUnsafeText(value: unknown): UnsafeText | null {
  const stack: { v: unknown; path: string[] }[] = [{ v: value, path: [] }];
  while (stack.length > 0) {
    const { v, path } = stack.pop()!;
    if (typeof v === "string") {
      const problem = problemOf(v);
      if (problem) return { path: path.join("."), problem };
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push({ v: v[i], path: [...path, String(i)] });
    } else if (v && typeof v === "object") {
      const entries = Object.entries(v);
      for (let i = entries.length - 1; i >= 0; i--) {
        const [k, child] = entries[i];
        const keyProblem = problemOf(k);
        if (keyProblem) return { path: [...path, k].join("."), problem: `has a field name that ${keyProblem}` };
        stack.push({ v: child, path: [...path, k] });
      }
    }
  }
  return null;
}
