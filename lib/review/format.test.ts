import { describe, it, expect } from "vitest";
import { escapeHtml, parseComment, parseInline, safeHref, toSafeHtml } from "./format";

// Attack strings from the OWASP XSS Filter Evasion Cheat Sheet and Cross Site Scripting
// Prevention Cheat Sheet (script tags, event attributes, javascript:/data: URLs), plus markdown
// image tricks; each must come out as inert text.
const XSS_CORPUS = [
  "<script>alert(1)</script>",
  "<img src=x onerror=alert(1)>",
  '<a href="javascript:alert(1)">x</a>',
  "[click](javascript:alert(1))",
  "[click](JaVaScRiPt:alert(1))",
  "[x](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)",
  "![img](https://example.com/x.png)",
  "![x](javascript:alert(1))",
  '<svg onload="alert(1)">',
  '"><iframe src="javascript:alert(1)"></iframe>',
  "<div style=\"background:url('javascript:alert(1)')\">",
  "data:text/html,<script>alert(1)</script>",
  "`<script>alert(1)</script>`",
];

function allHrefs(body: string): string[] {
  return parseComment(body).flatMap((b) => (b.type === "paragraph" ? b.lines.flat() : b.items.flat())).flatMap((n) => (n.type === "link" ? [n.href] : []));
}

describe("safeHref", () => {
  it("accepts only http and https URLs", () => {
    expect(safeHref("https://example.com/a?b=1")).toBe("https://example.com/a?b=1");
    expect(safeHref("http://example.com")).toBe("http://example.com/");
    // WHATWG URL Standard: the scheme is parsed case-insensitively, so these are javascript:/data:.
    for (const bad of ["javascript:alert(1)", "JAVASCRIPT:alert(1)", "data:text/html,x", "vbscript:x", "file:///etc/passwd", "/relative", "//host/x"]) {
      expect(safeHref(bad)).toBeNull();
    }
  });
});

describe("escapeHtml", () => {
  it("escapes the five characters HTML treats as markup", () => {
    // OWASP XSS Prevention Cheat Sheet, Rule #1: & < > " ' become entities.
    expect(escapeHtml(`&<>"'`)).toBe("&amp;&lt;&gt;&quot;&#39;");
  });
});

describe("parseComment", () => {
  it("keeps line breaks inside a paragraph and splits paragraphs on blank lines", () => {
    const blocks = parseComment("first\nsecond\n\nthird");
    expect(blocks).toEqual([
      { type: "paragraph", lines: [[{ type: "text", text: "first" }], [{ type: "text", text: "second" }]] },
      { type: "paragraph", lines: [[{ type: "text", text: "third" }]] },
    ]);
  });

  it("turns - and 1. lines into bullet and numbered lists", () => {
    const blocks = parseComment("- pad 3\n- pad 4\n1. check\n2. fix");
    expect(blocks.map((b) => (b.type === "list" ? [b.ordered, b.items.length] : b.type))).toEqual([
      [false, 2],
      [true, 2],
    ]);
  });

  it("marks `code`, links and mentions of known names", () => {
    const nodes = parseInline("see `VB1` at https://example.com/x. cc @Demo Analyst", ["Demo Analyst"]);
    expect(nodes).toEqual([
      { type: "text", text: "see " },
      { type: "code", text: "VB1" },
      { type: "text", text: " at " },
      { type: "link", href: "https://example.com/x", text: "https://example.com/x" },
      { type: "text", text: ". cc " },
      { type: "mention", text: "@Demo Analyst" },
    ]);
  });

  it("leaves an @ that names nobody as text", () => {
    expect(parseInline("mail me @nobody", ["Demo Analyst"])).toEqual([{ type: "text", text: "mail me @nobody" }]);
  });
});

describe("the XSS corpus", () => {
  for (const attack of XSS_CORPUS) {
    it(`renders ${JSON.stringify(attack)} inert`, () => {
      const html = toSafeHtml(parseComment(attack));
      // Only the tags we build may remain; any other "<" was escaped into text.
      const ours = html.replace(/<\/?(p|br|ul|ol|li|code|strong)>|<a href="https?:[^"]*" rel="noopener noreferrer">|<\/a>/g, "");
      expect(ours).not.toContain("<");
      expect(allHrefs(attack).every((h) => h.startsWith("http://") || h.startsWith("https://"))).toBe(true);
      expect(html).not.toMatch(/href="(javascript|data|vbscript):/i);
    });
  }

  it("shows a markdown image as its literal text instead of loading it", () => {
    expect(parseInline("![img](https://example.com/x.png)")).toEqual([{ type: "text", text: "![img](https://example.com/x.png)" }]);
  });

  it("escapes an injected tag into visible text", () => {
    expect(toSafeHtml(parseComment("<b>bold</b>"))).toBe("<p>&lt;b&gt;bold&lt;/b&gt;</p>");
  });
});
