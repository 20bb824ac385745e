import { Fragment, useMemo, type ComponentProps } from "react";
import { jsx, jsxs } from "react/jsx-runtime";
import { toJsxRuntime, type Components } from "hast-util-to-jsx-runtime";
import { commentTree } from "@/lib/review/format";

// Styling for the elements a comment can hold; the tree itself is already sanitised.
const COMPONENTS: Partial<Components> = {
  a: ({ node: _node, ...props }: ComponentProps<"a"> & { node?: unknown }) => (
    <a {...props} rel="noopener noreferrer nofollow" target="_blank" className="text-kerf-300 underline" />
  ),
  strong: ({ node: _node, className, ...props }: ComponentProps<"strong"> & { node?: unknown }) => (
    <strong {...props} className={className === "mention" ? "text-kerf-300" : "font-semibold"} />
  ),
  code: ({ node: _node, ...props }: ComponentProps<"code"> & { node?: unknown }) => (
    <code {...props} className="rounded bg-ink-800 px-1 font-mono text-[0.85em]" />
  ),
  pre: ({ node: _node, ...props }: ComponentProps<"pre"> & { node?: unknown }) => (
    <pre {...props} className="overflow-x-auto rounded bg-ink-800 p-2 [&>code]:bg-transparent [&>code]:p-0" />
  ),
  ul: ({ node: _node, ...props }: ComponentProps<"ul"> & { node?: unknown }) => <ul {...props} className="list-disc pl-5" />,
  ol: ({ node: _node, ...props }: ComponentProps<"ol"> & { node?: unknown }) => <ol {...props} className="list-decimal pl-5" />,
  blockquote: ({ node: _node, ...props }: ComponentProps<"blockquote"> & { node?: unknown }) => (
    <blockquote {...props} className="border-l-2 border-ink-600 pl-2 text-ink-300" />
  ),
  table: ({ node: _node, ...props }: ComponentProps<"table"> & { node?: unknown }) => (
    <div className="overflow-x-auto">
      <table {...props} className="border-collapse text-left [&_td]:border [&_td]:border-ink-700 [&_td]:px-2 [&_th]:border [&_th]:border-ink-700 [&_th]:px-2" />
    </div>
  ),
};

/**
 * A comment rendered from its sanitised syntax tree (see lib/review/format.ts): React escapes
 * every text node, links are http(s) only, and no HTML from the comment ever reaches the page.
 */
export function CommentBody({ body, names = [] }: { body: string; names?: readonly string[] }) {
  const content = useMemo(() => toJsxRuntime(commentTree(body, names), { Fragment, jsx, jsxs, components: COMPONENTS }), [body, names]);
  return <div className="flex flex-col gap-1.5 break-words text-sm text-ink-100">{content}</div>;
}
