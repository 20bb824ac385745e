import { commentHtml, escapeHtml } from "./format";
import { REVIEW_ACTION_DONE, actionPhrase, type ReviewAction } from "./review-status";

/** One message as the outbox stores it. */
export type MailContent = { readonly subject: string; readonly text: string; readonly html: string };

/** The page where a user chooses which mails they get (app/(workspace)/settings/notifications). */
const SETTINGS_PATH = "/settings/notifications";

/** Where the settings are, in the top bar's words, and the page's address on the same server as `link`. */
export function settingsFooter(link: string): { text: string; href: string } {
  const href = `${new URL(link).origin}${SETTINGS_PATH}`;
  return { text: `You get this because of your notification settings. Choose which mails you receive under "Notifications" in Kerfline's top bar`, href };
}

function wrapHtml(heading: string, bodyHtml: string, link: { href: string; label: string }, withFooter = true): string {
  const footer = settingsFooter(link.href);
  return [
    `<div style="font-family:sans-serif;font-size:14px;line-height:1.5">`,
    `<p><strong>${escapeHtml(heading)}</strong></p>`,
    bodyHtml,
    `<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>`,
    withFooter
      ? `<p style="color:#666;font-size:12px">${escapeHtml(footer.text)}: <a href="${escapeHtml(footer.href)}">${escapeHtml(footer.href)}</a></p>`
      : "",
    `</div>`,
  ]
    .filter(Boolean)
    .join("\n");
}

const footerText = (link: string) => {
  const f = settingsFooter(link);
  return `${f.text}: ${f.href}`;
};

function quote(body: string): string {
  return body
    .split(/\r?\n/)
    .map((l) => `> ${l}`)
    .join("\n");
}

/**
 * A reply on a remark the reader raised or replied to (`comment`), or a remark or reply naming
 * them (`mention`), with a deep link to the remark.
 */
export function commentMail(p: { kind: "comment" | "mention"; author: string; dieName: string; body: string; link: string }): MailContent {
  const heading = p.kind === "mention" ? `${p.author} named you in a remark on ${p.dieName}` : `${p.author} replied to a remark on ${p.dieName}`;
  return {
    subject: p.kind === "mention" ? `[Kerfline] ${p.author} named you in a remark on ${p.dieName}` : `[Kerfline] New reply to a remark on ${p.dieName}`,
    text: `${heading}:\n\n${quote(p.body)}\n\nOpen the remark: ${p.link}\n\n${footerText(p.link)}\n`,
    html: wrapHtml(heading, `<blockquote>${commentHtml(p.body)}</blockquote>`, { href: p.link, label: "Open the remark" }),
  };
}

/** A die sent to the checker, withdrawn, signed off or returned, with the message and a link to the die. */
export function reviewMail(p: { action: ReviewAction; actor: string; dieName: string; message: string; link: string }): MailContent {
  const what = REVIEW_ACTION_DONE[p.action];
  const heading = `${p.actor} ${actionPhrase(p.action, p.dieName)}`;
  const message = p.message.trim() ? `\n\n${quote(p.message)}` : "";
  return {
    subject: `[Kerfline] ${p.dieName} ${what}`,
    text: `${heading}.${message}\n\nOpen the die: ${p.link}\n\n${footerText(p.link)}\n`,
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
    // Invitations are not governed by notification settings, so they carry no settings footer.
    html: wrapHtml(heading, `<p>The link works once, until ${escapeHtml(until)}.</p>`, { href: p.link, label: "Accept the invitation" }, false),
  };
}
