import { commentHtml, escapeHtml } from "./format";
import { actionPhrase, type ReviewAction } from "./review-status";

/** One message as the outbox stores it. */
export type MailContent = { readonly subject: string; readonly text: string; readonly html: string };

const FOOTER_TEXT = "You can choose which notifications you receive under Settings → Notifications in Kerfline.";

function wrapHtml(heading: string, bodyHtml: string, link: { href: string; label: string }): string {
  return [
    `<div style="font-family:sans-serif;font-size:14px;line-height:1.5">`,
    `<p><strong>${escapeHtml(heading)}</strong></p>`,
    bodyHtml,
    `<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>`,
    `<p style="color:#666;font-size:12px">${escapeHtml(FOOTER_TEXT)}</p>`,
    `</div>`,
  ].join("\n");
}

function quote(body: string): string {
  return body
    .split(/\r?\n/)
    .map((l) => `> ${l}`)
    .join("\n");
}

/** A new comment (or a mention) on a thread, with a deep link to the thread. */
export function commentMail(p: { kind: "comment" | "mention"; author: string; dieName: string; body: string; link: string }): MailContent {
  const heading = p.kind === "mention" ? `${p.author} mentioned you on ${p.dieName}` : `${p.author} commented on ${p.dieName}`;
  return {
    subject: p.kind === "mention" ? `[Kerfline] ${p.author} mentioned you on ${p.dieName}` : `[Kerfline] New comment on ${p.dieName}`,
    text: `${heading}:\n\n${quote(p.body)}\n\nOpen the thread: ${p.link}\n\n${FOOTER_TEXT}\n`,
    html: wrapHtml(heading, `<blockquote>${commentHtml(p.body)}</blockquote>`, { href: p.link, label: "Open the thread" }),
  };
}

/** A die sent to the checker, withdrawn, signed off or returned, with the message and a link to the die. */
export function reviewMail(p: { action: ReviewAction; actor: string; dieName: string; message: string; link: string }): MailContent {
  const what = { send: "sent to the checker", withdraw: "withdrawn from the checker", sign_off: "signed off", return: "returned with remarks" }[p.action];
  const heading = `${p.actor} ${actionPhrase(p.action, p.dieName)}`;
  const message = p.message.trim() ? `\n\n${quote(p.message)}` : "";
  return {
    subject: `[Kerfline] ${p.dieName} ${what}`,
    text: `${heading}.${message}\n\nOpen the die: ${p.link}\n\n${FOOTER_TEXT}\n`,
    html: wrapHtml(heading, p.message.trim() ? `<blockquote>${commentHtml(p.message)}</blockquote>` : "", { href: p.link, label: "Open the die" }),
  };
}

/** An invitation to join a team, with the single-use link. */
export function invitationMail(p: { inviter: string; teamName: string; role: string; link: string; expiresAt: Date }): MailContent {
  const heading = `${p.inviter} invited you to join ${p.teamName} as ${p.role}`;
  const until = p.expiresAt.toISOString().slice(0, 10);
  return {
    subject: `[Kerfline] Invitation to join ${p.teamName}`,
    text: `${heading}.\n\nAccept the invitation (the link works once, until ${until}): ${p.link}\n`,
    html: wrapHtml(heading, `<p>The link works once, until ${escapeHtml(until)}.</p>`, { href: p.link, label: "Accept the invitation" }),
  };
}
