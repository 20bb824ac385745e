/**
 * Safe formatting of comment bodies. A comment is stored verbatim and read here as CommonMark
 * with the GFM extensions (tables, strikethrough, task lists, autolinks) by micromark through
 * `mdast-util-from-markdown`; raw HTML and footnotes are switched off at the parser. A pass of
 * ours over the syntax tree keeps only absolute http(s) links, shows images and unsafe links as
 * the literal text that was typed, turns line breaks into breaks and marks @mentions. The tree
 * then becomes HTML elements (`mdast-util-to-hast`), passes `hast-util-sanitize`, and is
 * rendered by React on the page (`hast-util-to-jsx-runtime`) and by `hast-util-to-html` for
 * e-mail: one tree for both, and nothing the user typed is ever passed on as HTML.
 */
import { fromMarkdown } from "mdast-util-from-markdown";
import { gfm } from "micromark-extension-gfm";
import { gfmFromMarkdown } from "mdast-util-gfm";
import { toHast } from "mdast-util-to-hast";
import { defaultSchema, sanitize, type Schema } from "hast-util-sanitize";
import { toHtml } from "hast-util-to-html";
import type { Definition, Nodes as MdNodes, Parent as MdParent, PhrasingContent, Root as MdRoot, RootContent } from "mdast";
import type { Element, Nodes as HastNodes, Root as HastRoot } from "hast";

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

const ESCAPES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };

/** Escapes text for HTML element content and double-quoted attributes (for our own mail frame). */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]);
}

// Raw HTML (block and inline) and GFM footnotes are not constructs of a comment: `<b>` is text.
const NO_HTML_NO_FOOTNOTES = {
  disable: { null: ["htmlFlow", "htmlText", "gfmFootnoteDefinition", "gfmFootnoteCall", "gfmPotentialFootnoteCall"] },
};

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

/** A text run split into text, breaks (for its line ends) and, outside links, mentions. */
function splitText(value: string, names: readonly string[], mentions: boolean): PhrasingContent[] {
  const out: PhrasingContent[] = [];
  let plain = "";
  const flush = () => {
    if (plain) out.push({ type: "text", value: plain });
    plain = "";
  };
  for (let i = 0; i < value.length; i++) {
    const c = value[i];
    if (c === "\n") {
      flush();
      out.push({ type: "break" });
      continue;
    }
    const name = c === "@" && mentions ? mentionAt(value, i, names) : null;
    if (!name) {
      plain += c;
      continue;
    }
    flush();
    const text = `@${name}`;
    out.push({ type: "strong", data: { hProperties: { className: ["mention"] } }, children: [{ type: "text", value: text }] });
    i += name.length;
  }
  flush();
  return out;
}

type Pass = { source: string; names: readonly string[]; definitions: Map<string, Definition> };

/** The characters the user typed for a node, to show it literally. */
function literal(node: MdNodes, pass: Pass): PhrasingContent {
  const start = node.position?.start.offset;
  const end = node.position?.end.offset;
  return { type: "text", value: start !== undefined && end !== undefined ? pass.source.slice(start, end) : "" };
}

function rewrite(node: RootContent, pass: Pass): RootContent | null {
  switch (node.type) {
    case "definition": // used by the references that name it; an unsafe one shows as typed
      return safeHref(node.url) ? null : { type: "paragraph", children: [literal(node, pass)] };
    case "html":
    case "image":
    case "imageReference":
    case "footnoteReference":
      return literal(node, pass);
    case "link": {
      const href = safeHref(node.url);
      return href ? { ...node, url: href } : literal(node, pass);
    }
    case "linkReference": {
      const href = safeHref(pass.definitions.get(node.identifier)?.url ?? "");
      return href ? { type: "link", url: href, children: node.children, position: node.position } : literal(node, pass);
    }
    default:
      return node;
  }
}

function walk(parent: MdParent, pass: Pass, inLink: boolean): void {
  const kept: RootContent[] = [];
  for (const child of parent.children) {
    const next = rewrite(child, pass);
    if (!next) continue;
    const last = kept[kept.length - 1];
    if (next.type === "text" && last?.type === "text") kept[kept.length - 1] = { type: "text", value: last.value + next.value };
    else kept.push(next);
  }
  parent.children = kept.flatMap((child): RootContent[] => {
    if (child.type === "text") return splitText(child.value, pass.names, !inLink);
    if ("children" in child) walk(child, pass, inLink || child.type === "link");
    return [child];
  }) as MdParent["children"];
}

const SCHEMA: Schema = {
  ...defaultSchema,
  tagNames: (defaultSchema.tagNames ?? []).filter((t) => t !== "img"),
  protocols: { ...defaultSchema.protocols, href: ["http", "https"], src: [] },
  attributes: { ...defaultSchema.attributes, strong: [["className", "mention"]] },
};

function addRel(node: HastNodes): void {
  if (node.type === "element" && node.tagName === "a") node.properties.rel = ["noopener", "noreferrer"];
  if ("children" in node) for (const c of node.children) addRel(c as Element);
}

/**
 * A comment as a sanitised HTML syntax tree (hast). `names` are the display names and e-mails
 * to mark as @mentions (`<strong class="mention">`).
 */
export function commentTree(body: string, names: readonly string[] = []): HastRoot {
  const source = body.replace(/\r\n?/g, "\n");
  const mdast: MdRoot = fromMarkdown(source, { extensions: [gfm(), NO_HTML_NO_FOOTNOTES], mdastExtensions: [gfmFromMarkdown()] });
  const definitions = new Map<string, Definition>();
  const collect = (n: MdNodes) => {
    if (n.type === "definition") definitions.set(n.identifier, n);
    if ("children" in n) n.children.forEach(collect);
  };
  collect(mdast);
  walk(mdast, { source, names, definitions }, false);
  const tree = sanitize(toHast(mdast), SCHEMA) as HastRoot;
  addRel(tree);
  return tree;
}

/** A comment as HTML for e-mail, from the same tree the page renders. */
export function commentHtml(body: string, names: readonly string[] = []): string {
  return toHtml(commentTree(body, names), { characterReferences: { useNamedReferences: true } });
}
