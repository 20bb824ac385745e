/**
 * Safe formatting of comment bodies. A comment is stored verbatim and turned here into a small
 * tree of our own node types (paragraphs, lists, text, code, links, mentions); the page renders
 * that tree as React elements and e-mail renders it through `toSafeHtml`, which escapes every
 * character of user text. Nothing the user typed is ever passed on as HTML.
 */

export type Inline =
  | { readonly type: "text"; readonly text: string }
  | { readonly type: "code"; readonly text: string }
  | { readonly type: "link"; readonly href: string; readonly text: string }
  | { readonly type: "mention"; readonly text: string };

export type Block =
  | { readonly type: "paragraph"; readonly lines: readonly (readonly Inline[])[] }
  | { readonly type: "list"; readonly ordered: boolean; readonly items: readonly (readonly Inline[])[] };

const BULLET = /^\s*[-*]\s+(.*)$/;
const NUMBERED = /^\s*\d{1,4}[.)]\s+(.*)$/;

/** Only absolute http(s) URLs become links; everything else (javascript:, data:, …) stays text. */
export function safeHref(raw: string): string | null {
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    return null;
  }
  if (url.protocol !== "http:" && url.protocol !== "https:") return null;
  return url.href;
}

// `code`, [text](url), a bare http(s) URL, or an @mention start.
const TOKEN = /`([^`\n]+)`|\[([^\]\n]{1,200})\]\(([^)\s]{1,2000})\)|(https?:\/\/[^\s<>"'`]+)|@/g;
const TRAILING = /[.,;:!?)\]]+$/;

function mentionAt(text: string, at: number, names: readonly string[]): string | null {
  if (at > 0 && !/\s|[(\[]/.test(text[at - 1])) return null;
  const rest = text.slice(at + 1).toLowerCase();
  let best: string | null = null;
  for (const n of names) {
    const lower = n.toLowerCase();
    if (!lower || !rest.startsWith(lower)) continue;
    const after = rest[lower.length];
    if (after !== undefined && /[\p{L}\p{N}_@]/u.test(after)) continue;
    if (!best || n.length > best.length) best = text.slice(at + 1, at + 1 + n.length);
  }
  return best;
}

/** Splits one line into inline nodes; `names` are the display names and e-mails to mark as mentions. */
export function parseInline(text: string, names: readonly string[] = []): Inline[] {
  const out: Inline[] = [];
  let plain = "";
  const flush = () => {
    if (plain) out.push({ type: "text", text: plain });
    plain = "";
  };
  let last = 0;
  for (const m of text.matchAll(TOKEN)) {
    const at = m.index ?? 0;
    if (at < last) continue;
    plain += text.slice(last, at);
    last = at + m[0].length;
    if (m[1] !== undefined) {
      flush();
      out.push({ type: "code", text: m[1] });
    } else if (m[2] !== undefined) {
      const href = safeHref(m[3]);
      // An image trick (![x](…)) or an unsafe target shows as the literal text it was.
      if (!href || text[at - 1] === "!") plain += m[0];
      else {
        flush();
        out.push({ type: "link", href, text: m[2] });
      }
    } else if (m[4] !== undefined) {
      const url = m[4].replace(TRAILING, "");
      const href = safeHref(url);
      last = at + url.length;
      if (!href) plain += url;
      else {
        flush();
        out.push({ type: "link", href, text: url });
      }
    } else {
      const name = mentionAt(text, at, names);
      if (!name) plain += "@";
      else {
        flush();
        out.push({ type: "mention", text: `@${name}` });
        last = at + 1 + name.length;
      }
    }
  }
  plain += text.slice(last);
  flush();
  return out;
}

/** Parses a comment body into blocks: runs of list lines become lists, the rest paragraphs. */
export function parseComment(body: string, names: readonly string[] = []): Block[] {
  const blocks: Block[] = [];
  const lines = body.replace(/\r\n?/g, "\n").split("\n");
  let para: Inline[][] = [];
  let list: { ordered: boolean; items: Inline[][] } | null = null;
  const end = () => {
    if (para.length) blocks.push({ type: "paragraph", lines: para });
    if (list) blocks.push({ type: "list", ordered: list.ordered, items: list.items });
    para = [];
    list = null;
  };
  for (const line of lines) {
    const bullet = BULLET.exec(line);
    const numbered = bullet ? null : NUMBERED.exec(line);
    const item = bullet ?? numbered;
    if (item) {
      const ordered = !!numbered;
      if (para.length || (list && list.ordered !== ordered)) end();
      list ??= { ordered, items: [] };
      list.items.push(parseInline(item[1], names));
    } else if (line.trim() === "") end();
    else {
      if (list) end();
      para.push(parseInline(line, names));
    }
  }
  end();
  return blocks;
}

const ESCAPES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };

/** Escapes text for HTML element content and double-quoted attributes. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]);
}

function inlineHtml(nodes: readonly Inline[]): string {
  return nodes
    .map((n) => {
      if (n.type === "code") return `<code>${escapeHtml(n.text)}</code>`;
      if (n.type === "link") return `<a href="${escapeHtml(n.href)}" rel="noopener noreferrer">${escapeHtml(n.text)}</a>`;
      if (n.type === "mention") return `<strong>${escapeHtml(n.text)}</strong>`;
      return escapeHtml(n.text);
    })
    .join("");
}

/** HTML built by us from the tree (for e-mail): every piece of user text is escaped. */
export function toSafeHtml(blocks: readonly Block[]): string {
  return blocks
    .map((b) => {
      if (b.type === "paragraph") return `<p>${b.lines.map(inlineHtml).join("<br>")}</p>`;
      const tag = b.ordered ? "ol" : "ul";
      return `<${tag}>${b.items.map((i) => `<li>${inlineHtml(i)}</li>`).join("")}</${tag}>`;
    })
    .join("\n");
}
