import { describe, it, expect } from "vitest";
import { commentHtml, commentTree, escapeHtml, safeHref } from "./format";

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
  "[r][bad]\n\n[bad]: javascript:alert(1)",
  "<javascript:alert(1)>",
  "mail a@b.test",
];

type Node = { type: string; tagName?: string; properties?: Record<string, unknown>; children?: Node[]; value?: string };
function elements(node: Node): Node[] {
  return [...(node.type === "element" ? [node] : []), ...(node.children ?? []).flatMap(elements)];
}
function allHrefs(body: string): string[] {
  return elements(commentTree(body) as Node).flatMap((e) => (e.tagName === "a" ? [String(e.properties?.href)] : []));
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

// Expected HTML follows the CommonMark 0.31 and GFM 0.29 specifications' examples.
describe("commentHtml (CommonMark + GFM)", () => {
  it("keeps line breaks inside a paragraph and splits paragraphs on blank lines", () => {
    expect(commentHtml("first\nsecond\n\nthird")).toBe("<p>first<br>\nsecond</p>\n<p>third</p>");
  });

  it("turns - and 1. lines into bullet and numbered lists", () => {
    expect(commentHtml("- pad 3\n- pad 4\n1. check\n2. fix")).toBe("<ul>\n<li>pad 3</li>\n<li>pad 4</li>\n</ul>\n<ol>\n<li>check</li>\n<li>fix</li>\n</ol>");
  });

  it("marks `code`, links and mentions of known names", () => {
    expect(commentHtml("see `VB1` at https://example.com/x. cc @Demo Analyst", ["Demo Analyst"])).toBe(
      '<p>see <code>VB1</code> at <a href="https://example.com/x" rel="noopener noreferrer">https://example.com/x</a>. cc <strong class="mention">@Demo Analyst</strong></p>',
    );
  });

  it("marks a mention by e-mail and leaves an @ that names nobody as text", () => {
    expect(commentHtml("@viewer@fjordlight.test look", ["viewer@fjordlight.test"])).toBe(
      '<p><strong class="mention">@viewer@fjordlight.test</strong> look</p>',
    );
    expect(commentHtml("mail me @nobody", ["Demo Analyst"])).toBe("<p>mail me @nobody</p>");
  });

  it("renders emphasis, strong emphasis and strikethrough", () => {
    expect(commentHtml("*thin* **bold** ~~gone~~")).toBe("<p><em>thin</em> <strong>bold</strong> <del>gone</del></p>");
  });

  it("renders inline code and fenced code blocks with their text escaped", () => {
    expect(commentHtml("```txt\nVB1 <-> VB2 & GND\n```")).toBe('<pre><code class="language-txt">VB1 &lt;-> VB2 &amp; GND\n</code></pre>');
  });

  it("renders a GFM table with its column alignment", () => {
    expect(commentHtml("| pad | net |\n|---|:-:|\n| 3 | *vcc* |")).toBe(
      '<table>\n<thead>\n<tr>\n<th>pad</th>\n<th align="center">net</th>\n</tr>\n</thead>\n<tbody>\n<tr>\n<td>3</td>\n<td align="center"><em>vcc</em></td>\n</tr>\n</tbody>\n</table>',
    );
  });

  it("renders inline, reference, angle-bracket and bare www links, all http(s) with rel", () => {
    expect(commentHtml('[a](https://a.test/x "t") [b][1] <https://c.test/> www.d.test\n\n[1]: https://b.test/')).toBe(
      '<p><a href="https://a.test/x" title="t" rel="noopener noreferrer">a</a> <a href="https://b.test/" rel="noopener noreferrer">b</a> ' +
        '<a href="https://c.test/" rel="noopener noreferrer">https://c.test/</a> <a href="http://www.d.test/" rel="noopener noreferrer">www.d.test</a></p>',
    );
  });

  it("does not mark mentions inside link text", () => {
    expect(commentHtml("[@Demo Analyst](https://a.test/)", ["Demo Analyst"])).toBe(
      '<p><a href="https://a.test/" rel="noopener noreferrer">@Demo Analyst</a></p>',
    );
  });

  it("renders task lists as disabled checkboxes", () => {
    expect(commentHtml("- [x] probed")).toBe(
      '<ul class="contains-task-list">\n<li class="task-list-item"><input type="checkbox" checked disabled> probed</li>\n</ul>',
    );
  });
});

describe("the XSS corpus", () => {
  for (const attack of XSS_CORPUS) {
    it(`renders ${JSON.stringify(attack)} inert`, () => {
      const html = commentHtml(attack);
      // Only the tags the markdown tree builds may remain; any other "<" was escaped into text.
      const ours = html.replace(/<\/?(p|br|ul|ol|li|code|pre|strong|em|del)>|<a href="https?:[^"]*" rel="noopener noreferrer">|<\/a>/g, "");
      expect(ours).not.toContain("<");
      expect(allHrefs(attack).every((h) => h.startsWith("http://") || h.startsWith("https://"))).toBe(true);
      // No element carries a javascript:, data:, vbscript: or mailto: URL (text may show one, inert).
      for (const e of elements(commentTree(attack) as Node)) {
        for (const key of ["href", "src"]) expect(String(e.properties?.[key] ?? "")).not.toMatch(/^(javascript|data|vbscript|mailto):/i);
      }
      expect(elements(commentTree(attack) as Node).map((e) => e.tagName)).not.toContain("img");
    });
  }

  it("shows a markdown image as its literal text instead of loading it", () => {
    expect(commentHtml("![img](https://example.com/x.png)")).toBe("<p>![img](https://example.com/x.png)</p>");
  });

  it("shows an unsafe link as the literal text that was typed", () => {
    expect(commentHtml("[click](javascript:alert(1))")).toBe("<p>[click](javascript:alert(1))</p>");
  });

  it("escapes an injected tag into visible text", () => {
    // HTML Standard §13.1.2: only "<" and "&" start markup in text, so ">" may stay as it is.
    expect(commentHtml("<b>bold</b>")).toBe("<p>&lt;b>bold&lt;/b></p>");
  });
});
