import type { ApiClient } from "../support/client";

export type Thread = {
  id: string;
  status: "open" | "resolved";
  orphaned: boolean;
  shapeId: string | null;
  anchor: { type: string };
  pin: [number, number];
  resolvedBy: { id: string; name: string } | null;
  resolvedAt: string | null;
  comments: { id: string; body: string; authorId: string; mentions: string[] }[];
};
export type MailEntry = { id: string; subject: string; to: string; date: string };
export type StoredMail = MailEntry & { text: string; html: string | null };

/** A 100 µm square region at (x, y) in die µm, as a GeoJSON Polygon. */
export function square(x: number, y: number, size = 100) {
  return {
    type: "Polygon",
    coordinates: [
      [
        [x, y],
        [x + size, y],
        [x + size, y + size],
        [x, y + size],
        [x, y],
      ],
    ],
  };
}

/** A pad shape on the die, made by a client with the edit right. */
export async function addPad(editor: ApiClient, dieId: string, x = 100, y = 100): Promise<string> {
  const res = await editor.request<{ id: string }>("POST", `/api/dies/${dieId}/markup`, {
    kind: "pad",
    geometry: square(x, y, 80),
    properties: { label: "VB1" },
  });
  if (res.status !== 201) throw new Error(`could not add a pad: ${res.status} ${JSON.stringify(res.body)}`);
  return (Array.isArray(res.body) ? res.body[0] : res.body).id;
}

/** Polls the owner's local mailbox until a message to `to` that matches (and whose text holds `textIncludes`) arrives. */
export async function waitForMail(owner: ApiClient, to: string, match: (m: MailEntry) => boolean, textIncludes = "", timeoutMs = 60_000): Promise<StoredMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const list = await owner.get<MailEntry[]>("/api/mailbox");
    const hits = Array.isArray(list.body) ? list.body.filter((m) => m.to.includes(to) && match(m)) : [];
    for (const hit of hits) {
      const mail = (await owner.get<StoredMail>(`/api/mailbox/${hit.id}`)).body;
      if (mail.text.includes(textIncludes)) return mail;
    }
    if (Date.now() > deadline) throw new Error(`no mail to ${to} arrived; mailbox answered ${list.status} ${JSON.stringify(list.body).slice(0, 400)}`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

/** The single-use invitation link in an invitation mail's text part. */
export function invitationToken(mail: StoredMail): string {
  const m = /\/invitations\/([A-Za-z0-9_-]{20,})/.exec(mail.text);
  if (!m) throw new Error(`no invitation link in: ${mail.text}`);
  return m[1];
}
