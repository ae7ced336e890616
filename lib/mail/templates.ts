/** Plain, small e-mails: many readers open them on phones with costly data, so no images. */
export type MailTemplate =
  | { name: "verify-email"; data: { name: string; url: string } }
  | { name: "reset-password"; data: { name: string; url: string } };

export type RenderedMail = { subject: string; text: string; html: string };

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c);
}

function layout(title: string, paragraphs: string[], action: { label: string; url: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`).join("");
  return `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#26241f;background:#f7f6f3;padding:24px">
<div style="max-width:520px;margin:auto;background:#fff;border-radius:12px;padding:24px">
<p style="font-weight:700;color:#135851;margin:0 0 16px">Shoal</p>
<h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(title)}</h1>${body}
<p><a href="${escapeHtml(action.url)}" style="display:inline-block;background:#176d64;color:#fff;padding:10px 18px;border-radius:8px;text-decoration:none">${escapeHtml(action.label)}</a></p>
<p style="font-size:12px;color:#615c4f">If the button does not work, paste this link into your browser:<br>${escapeHtml(action.url)}</p>
</div></body></html>`;
}

export function renderMail(template: MailTemplate): RenderedMail {
  switch (template.name) {
    case "verify-email": {
      const { name, url } = template.data;
      const paragraphs = [
        `Hello ${name},`,
        "Confirm this e-mail address to finish opening your Shoal account. The link works for 24 hours.",
        "If you did not sign up, you can ignore this message.",
      ];
      return {
        subject: "Confirm your e-mail for Shoal",
        text: `${paragraphs.join("\n\n")}\n\nConfirm: ${url}\n`,
        html: layout("Confirm your e-mail", paragraphs, { label: "Confirm e-mail", url }),
      };
    }
    case "reset-password": {
      const { name, url } = template.data;
      const paragraphs = [
        `Hello ${name},`,
        "Someone asked to set a new password for your Shoal account. The link works for one hour.",
        "If it was not you, ignore this message: your password stays as it is.",
      ];
      return {
        subject: "Set a new Shoal password",
        text: `${paragraphs.join("\n\n")}\n\nNew password: ${url}\n`,
        html: layout("Set a new password", paragraphs, { label: "Choose a new password", url }),
      };
    }
  }
}
