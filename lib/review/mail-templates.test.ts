import { describe, expect, it } from "vitest";
import { commentMail, invitationMail, reviewMail, settingsFooter } from "./mail-templates";

const link = "http://localhost:3000/dies/0b7a3c1e-2f4d-4e6a-9b8c-1d2e3f4a5b6c?thread=9f8e7d6c-5b4a-4392-8170-6f5e4d3c2b1a";

describe("notification mail", () => {
  it("speaks of remarks: a reply, a naming, and the link to open the remark", () => {
    const reply = commentMail({ kind: "comment", author: "Demo Analyst", dieName: "NV-24R die A", body: "Pad 7 is VB2.", link });
    expect(reply.subject).toBe("[Kerfline] New reply to a remark on NV-24R die A");
    expect(reply.text).toContain(`Open the remark: ${link}`);
    expect(reply.html).toContain(">Open the remark</a>");
    const named = commentMail({ kind: "mention", author: "Demo Reviewer", dieName: "NV-24R die A", body: "@Demo Analyst see pad 7", link });
    expect(named.subject).toBe("[Kerfline] Demo Reviewer named you in a remark on NV-24R die A");
  });

  it("ends with where the settings are: the top bar's Notifications page on the same server", () => {
    expect(settingsFooter(link).href).toBe("http://localhost:3000/settings/notifications");
    const m = reviewMail({ action: "sign_off", actor: "Demo Reviewer", dieName: "NV-24R die A", message: "", link: "https://lab.example/dies/x" });
    expect(m.text).toContain('under "Notifications" in Kerfline\'s top bar: https://lab.example/settings/notifications');
    expect(m.html).toContain('<a href="https://lab.example/settings/notifications">');
  });

  it("leaves the settings footer off invitations, which those settings do not govern", () => {
    const m = invitationMail({
      inviter: "Demo Owner",
      teamName: "Fjordlight Failure Lab",
      role: "reviewer",
      link,
      expiresAt: new Date("2026-12-10T00:00:00Z"),
    });
    expect(m.html).not.toContain("/settings/notifications");
    expect(m.text).not.toContain("/settings/notifications");
  });
});
