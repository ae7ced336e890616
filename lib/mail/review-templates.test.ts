import { describe, expect, it } from "vitest";
import { reviewReceivedMail, reviewReplyMail, reviewRequestMail } from "./review-templates";

// A review's words are the farmer's own: the HTML part must show them as text (HTML Standard, "escapable raw
// text": <, >, & and quotes are written as character references), and a long one is cut in the mail.
describe("review e-mails", () => {
  it("escapes the farmer's words in the HTML part and keeps them in the text part", () => {
    const body = 'Great <script>alert("x")</script> & fast';
    const mail = reviewReceivedMail({ name: "Blue Basin", authorName: "Chanda M.", stars: 4, body, subjectLabel: "Nile tilapia · 500 fingerlings", url: "http://127.0.0.1:3000/providers/p#review-r" });
    expect(mail.html).not.toContain("<script>");
    expect(mail.html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; fast");
    expect(mail.text).toContain(body);
    expect(mail.subject).toBe("New review: 4 stars out of 5");
  });

  it("quotes at most 280 characters of a long review or reply", () => {
    const long = "word ".repeat(200);
    const mail = reviewReplyMail({ name: "Chanda", providerName: "Blue Basin", body: long, url: "http://127.0.0.1:3000/x" });
    const quote = mail.text.split("\n\n").find((p) => p.startsWith('"')) ?? "";
    expect(quote.length).toBeLessThanOrEqual(282);
    expect(quote.endsWith('…"')).toBe(true);
  });

  it("asks for a review with a link to the form", () => {
    const mail = reviewRequestMail({ name: "Chanda", providerName: "Solid Ground Tanks", what: "the builder and the tank", subjectLabel: "Tarpaulin on frame · 3 × 2 m, 1 m deep", url: "http://127.0.0.1:3000/farmer/requests/r1/review" });
    expect(mail.subject).toBe("How did it go with Solid Ground Tanks?");
    expect(mail.text).toContain("Write a review: http://127.0.0.1:3000/farmer/requests/r1/review");
  });
});
