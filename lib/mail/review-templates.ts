import { composeMail, type RenderedMail } from "./layout";

// E-mails about reviews: asking the farmer for one when a job or reservation is finished, telling the provider
// when one arrives, and the author when the provider replies. Plain text only: review words are the farmer's own
// and are quoted as text (composeMail escapes them for the HTML part).

export const REVIEW_MAIL_TEMPLATES = ["review-request", "review-received", "review-reply"] as const;
export type ReviewMailTemplate = (typeof REVIEW_MAIL_TEMPLATES)[number];

export function isReviewMailTemplate(value: string): value is ReviewMailTemplate {
  return (REVIEW_MAIL_TEMPLATES as readonly string[]).includes(value);
}

/** How long a quoted review body may be in an e-mail before it is cut (the page has the whole text). */
const QUOTE_CHARS = 280;

function quoted(body: string): string {
  const flat = body.replace(/\s+/g, " ").trim();
  return flat.length > QUOTE_CHARS ? `"${flat.slice(0, QUOTE_CHARS - 1).trimEnd()}…"` : `"${flat}"`;
}

function starsText(stars: number): string {
  return `${stars} ${stars === 1 ? "star" : "stars"} out of 5`;
}

export type ReviewRequestMailData = {
  name: string;
  providerName: string;
  /** "the tank" or "the fish" */
  what: string;
  /** e.g. "Tarpaulin on frame · 3 × 2 m" */
  subjectLabel: string;
  /** the last day an edit is possible is counted from writing, not from this mail, so no deadline here */
  url: string;
};

export function reviewRequestMail(d: ReviewRequestMailData): RenderedMail {
  return composeMail(
    "review-request",
    `How did it go with ${d.providerName}?`,
    "Tell other farmers how it went",
    [
      `Hello ${d.name},`,
      `Your order with ${d.providerName} (${d.subjectLabel}) is finished. A few honest lines about ${d.what} help the next farmer choose, and help good providers get found.`,
      "Give stars overall and for each part that matters, say what went well or not, and add photos if you have them. You can correct your review for 14 days after you post it.",
    ],
    { label: "Write a review", url: d.url },
  );
}

export type ReviewReceivedMailData = { name: string; authorName: string; stars: number; body: string; subjectLabel: string; url: string };

export function reviewReceivedMail(d: ReviewReceivedMailData): RenderedMail {
  return composeMail(
    "review-received",
    `New review: ${starsText(d.stars)}`,
    "A farmer reviewed your work",
    [
      `Hello ${d.name},`,
      `${d.authorName} reviewed ${d.subjectLabel} and gave ${starsText(d.stars)}:`,
      quoted(d.body),
      "You can answer once, publicly, under the review. A calm, factual reply often tells the next customer more than the review itself. If the review is abusive or untrue, report it and Shoal will look at it.",
    ],
    { label: "See the review", url: d.url },
  );
}

export type ReviewReplyMailData = { name: string; providerName: string; body: string; url: string };

export function reviewReplyMail(d: ReviewReplyMailData): RenderedMail {
  return composeMail(
    "review-reply",
    `${d.providerName} replied to your review`,
    "Your review has a reply",
    [`Hello ${d.name},`, `${d.providerName} answered your review:`, quoted(d.body)],
    { label: "Read the reply", url: d.url },
  );
}
