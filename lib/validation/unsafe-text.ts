/**
 * Text that PostgreSQL cannot store or that is not well-formed Unicode: a NUL character
 * (PostgreSQL text and jsonb refuse U+0000) or a lone UTF-16 surrogate (a JSON escape such as
 * "\ud800" without its pair; not a Unicode scalar value, so it has no UTF-8 form).
 */
export type UnsafeText = { path: string; problem: string };

function problemOf(s: string): string | null {
  if (s.includes("\u0000")) return "contains a NUL character";
  if (!s.isWellFormed()) return "contains a lone surrogate (not valid Unicode text)";
  return null;
}

// A node remembers its parent and key, so a path is built only for the string that is refused:
// an import body holds hundreds of thousands of values and copying a path for each would cost more
// than the check itself.
type Node = { v: unknown; key: string | null; parent: Node | null };

function pathOf(node: Node, last?: string): string {
  const keys: string[] = last === undefined ? [] : [last];
  for (let n: Node | null = node; n && n.key !== null; n = n.parent) keys.push(n.key);
  return keys.reverse().join(".");
}

/** The first string in a parsed JSON value that cannot be stored, with its path ("features.3.properties.text"). */
export function findUnsafeText(value: unknown): UnsafeText | null {
  const stack: Node[] = [{ v: value, key: null, parent: null }];
  while (stack.length > 0) {
    const node = stack.pop()!;
    const { v } = node;
    if (typeof v === "string") {
      const problem = problemOf(v);
      if (problem) return { path: pathOf(node), problem };
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push({ v: v[i], key: String(i), parent: node });
    } else if (v && typeof v === "object") {
      const entries = Object.entries(v);
      for (let i = entries.length - 1; i >= 0; i--) {
        const [k, child] = entries[i];
        const keyProblem = problemOf(k);
        if (keyProblem) return { path: pathOf(node, k), problem: `has a field name that ${keyProblem}` };
        stack.push({ v: child, key: k, parent: node });
      }
    }
  }
  return null;
}

/** The same check for the text fields of a form (server actions): a message naming the field, or null. */
export function formTextProblem(form: { entries(): IterableIterator<[string, unknown]> }): string | null {
  const texts: Record<string, string> = {};
  for (const [k, v] of form.entries()) if (typeof v === "string") texts[k] = v;
  const unsafe = findUnsafeText(texts);
  return unsafe ? `${unsafe.path} ${unsafe.problem}.` : null;
}
