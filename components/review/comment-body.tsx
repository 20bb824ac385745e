import { parseComment, type Inline } from "@/lib/review/format";

function InlineNodes({ nodes }: { nodes: readonly Inline[] }) {
  return (
    <>
      {nodes.map((n, i) => {
        if (n.type === "code") return <code key={i} className="rounded bg-ink-800 px-1 font-mono text-[0.85em]">{n.text}</code>;
        if (n.type === "link")
          return (
            <a key={i} href={n.href} rel="noopener noreferrer nofollow" target="_blank" className="text-kerf-300 underline">
              {n.text}
            </a>
          );
        if (n.type === "mention") return <strong key={i} className="text-kerf-300">{n.text}</strong>;
        return <span key={i}>{n.text}</span>;
      })}
    </>
  );
}

/**
 * A comment rendered from our own parse tree: React escapes every text node, links are
 * http(s) only, and no HTML from the comment ever reaches the page.
 */
export function CommentBody({ body, names = [] }: { body: string; names?: readonly string[] }) {
  return (
    <div className="flex flex-col gap-1.5 break-words text-sm text-ink-100">
      {parseComment(body, names).map((b, i) =>
        b.type === "paragraph" ? (
          <p key={i}>
            {b.lines.map((l, j) => (
              <span key={j}>
                {j > 0 && <br />}
                <InlineNodes nodes={l} />
              </span>
            ))}
          </p>
        ) : b.ordered ? (
          <ol key={i} className="list-decimal pl-5">
            {b.items.map((it, j) => (
              <li key={j}>
                <InlineNodes nodes={it} />
              </li>
            ))}
          </ol>
        ) : (
          <ul key={i} className="list-disc pl-5">
            {b.items.map((it, j) => (
              <li key={j}>
                <InlineNodes nodes={it} />
              </li>
            ))}
          </ul>
        ),
      )}
    </div>
  );
}
