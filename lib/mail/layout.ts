/** Plain, small e-mails: many readers open them on phones with costly data, so no images. */
export type RenderedMail = { template: string; subject: string; text: string; html: string };

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c);
}

/** One message in Shoal's plain layout: a title, paragraphs of text, and at most one button. */
export function composeMail(template: string, subject: string, title: string, paragraphs: string[], action?: { label: string; url: string }): RenderedMail {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`).join("");
  const button = action
    ? `<p><a href="${escapeHtml(action.url)}" style="display:inline-block;background:#176d64;color:#fff;padding:10px 18px;border-radius:8px;text-decoration:none">${escapeHtml(action.label)}</a></p>
<p style="font-size:12px;color:#615c4f">If the button does not work, paste this link into your browser:<br>${escapeHtml(action.url)}</p>`
    : "";
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#26241f;background:#f7f6f3;padding:24px">
<div style="max-width:520px;margin:auto;background:#fff;border-radius:12px;padding:24px">
<p style="font-weight:700;color:#135851;margin:0 0 16px">Shoal</p>
<h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(title)}</h1>${body}${button}
</div></body></html>`;
  const text = `${paragraphs.join("\n\n")}${action ? `\n\n${action.label}: ${action.url}` : ""}\n`;
  return { template, subject, text, html };
}
