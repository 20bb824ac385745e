import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CommentBody } from "./comment-body";

const render = (body: string, names: string[] = []) => renderToStaticMarkup(createElement(CommentBody, { body, names }));

describe("CommentBody", () => {
  it("renders markdown lists, emphasis, code, tables and mentions as React elements", () => {
    const html = render("- *one*\n- `two`\n\n| a |\n|---|\n| b |\n\ncc @Demo Analyst", ["Demo Analyst"]);
    expect(html).toContain('<ul class="list-disc pl-5">\n<li><em>one</em></li>');
    expect(html).toContain('<code class="rounded bg-ink-800 px-1 font-mono text-[0.85em]">two</code>');
    expect(html).toContain("<td>b</td>");
    expect(html).toContain('<strong class="text-kerf-300">@Demo Analyst</strong>');
  });

  it("opens http(s) links in a new tab without referrer and never renders script or javascript: links", () => {
    const html = render('[ok](https://a.test/) [bad](javascript:alert(1)) <script>alert(1)</script> <a href="javascript:x">y</a>');
    expect(html).toContain('<a href="https://a.test/" rel="noopener noreferrer nofollow" target="_blank" class="text-kerf-300 underline">ok</a>');
    expect(html).not.toMatch(/<script|<a href="javascript/i);
    expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
  });
});
