import type { JobMailRecipient, JobMailTemplate } from "@/lib/jobs/state";
import { composeMail, type RenderedMail } from "./layout";

// E-mails about tank requests, quotes and jobs. One function per message; callers pass ready-made text (money
// already formatted), so templates stay free of the domain's arithmetic.

export function tankRequestNearbyMail(data: { name: string; tank: string; distance: string; wantedBy: string; url: string }): RenderedMail {
  return composeMail(
    "tank-request-nearby",
    `New tank request ${data.distance} from you`,
    "A farmer near you wants a tank",
    [
      `Hello ${data.name},`,
      `A farmer wants a ${data.tank}, by ${data.wantedBy}. The site is ${data.distance} from your base in a straight line, inside your service area.`,
      "Open the request to see the site details and send a quote. Travel is worked out for you from the distance and your rate per km.",
    ],
    { label: "See the request", url: data.url },
  );
}

export function quoteReceivedMail(data: { name: string; builder: string; total: string; revised: boolean; url: string }): RenderedMail {
  const what = data.revised ? "revised its quote" : "sent you a quote";
  return composeMail(
    data.revised ? "quote-revised" : "quote-received",
    data.revised ? `${data.builder} revised its quote` : `New quote from ${data.builder}`,
    data.revised ? "A quote was revised" : "You have a new quote",
    [`Hello ${data.name},`, `${data.builder} ${what} for your tank: ${data.total} in total.`, "Compare it with the other quotes side by side before you choose."],
    { label: "Compare quotes", url: data.url },
  );
}

export function quoteWithdrawnMail(data: { name: string; builder: string; url: string }): RenderedMail {
  return composeMail(
    "quote-withdrawn",
    `${data.builder} withdrew its quote`,
    "A quote was withdrawn",
    [`Hello ${data.name},`, `${data.builder} withdrew its quote for your tank request. The other quotes are still open.`],
    { label: "See your request", url: data.url },
  );
}

export function quoteAcceptedMail(data: { name: string; farmer: string; total: string; deposit: string; url: string }): RenderedMail {
  return composeMail(
    "quote-accepted",
    "Your quote was accepted",
    "You won the job",
    [
      `Hello ${data.name},`,
      `${data.farmer} accepted your quote of ${data.total}.`,
      `The farmer now pays a deposit of ${data.deposit}. Shoal holds it and tells you as soon as it is held; do not buy materials before that.`,
    ],
    { label: "Open the job", url: data.url },
  );
}

export function quoteNotChosenMail(data: { name: string; url: string }): RenderedMail {
  return composeMail(
    "quote-not-chosen",
    "The farmer chose another quote",
    "Another quote was chosen",
    [`Hello ${data.name},`, "The farmer accepted another builder's quote for this tank, so yours is closed. Thank you for quoting; more requests near you will come by e-mail."],
    { label: "Open requests near you", url: data.url },
  );
}

export function requestClosedMail(data: { name: string; url: string }): RenderedMail {
  return composeMail(
    "tank-request-closed",
    "A tank request you quoted on was closed",
    "The request was closed",
    [`Hello ${data.name},`, "The farmer closed this tank request without choosing a quote, so your quote is closed too."],
    { label: "Open requests near you", url: data.url },
  );
}

export function depositHeldMail(data: { name: string; deposit: string; url: string }): RenderedMail {
  return composeMail(
    "job-deposit-held",
    "The deposit is held: the job is booked",
    "The deposit is held",
    [
      `Hello ${data.name},`,
      `The farmer paid the deposit of ${data.deposit}. Shoal holds it until the farmer confirms the finished tank, then pays it to you.`,
      "Mark the job on site when you arrive, and add photos of the finished tank before you mark it built.",
    ],
    { label: "Open the job", url: data.url },
  );
}

const JOB_TEXT: Record<JobMailTemplate, Partial<Record<JobMailRecipient, { subject: string; title: string; body: string }>>> = {
  "job-started": {
    farmer: { subject: "Your builder is on site", title: "Work has started", body: "Your builder marked the job on site. You will get a message when the tank is built." },
  },
  "job-built": {
    farmer: {
      subject: "Your tank is built: check it and confirm",
      title: "Your tank is built",
      body: "Your builder marked the tank built and added photos. Fill it and watch the water level for a few days: confirm when you are happy (the deposit is then paid to the builder), or open a dispute if something is wrong. With no answer the job confirms itself after a week.",
    },
  },
  "job-completed": {
    farmer: { subject: "Job completed", title: "The job is completed", body: "The job is completed and the deposit was paid to your builder. Thank you for building through Shoal." },
    builder: { subject: "Job completed: the deposit is released to you", title: "The job is completed", body: "The farmer's confirmation closed the job and the deposit is released to you. The tank now shows in your portfolio, marked as done through Shoal." },
  },
  "job-cancelled": {
    farmer: { subject: "Job cancelled", title: "The job was cancelled", body: "The job was cancelled before work started. Any deposit held goes back to you." },
    builder: { subject: "Job cancelled", title: "The job was cancelled", body: "The farmer cancelled the job before work started. The deposit goes back to the farmer." },
  },
  "job-disputed": {
    builder: { subject: "The farmer opened a dispute", title: "A dispute was opened", body: "The farmer is not satisfied and opened a dispute. The deposit stays held while Shoal looks at the job; an admin will contact you both." },
    admins: { subject: "A job dispute needs a decision", title: "A job is in dispute", body: "A farmer opened a dispute on a job. The deposit is frozen until an admin resolves it." },
  },
  "job-dispute-resolved": {
    farmer: { subject: "Your dispute was settled", title: "The dispute was settled", body: "Shoal settled the dispute. Open the job to see how the deposit was shared." },
    builder: { subject: "The dispute was settled", title: "The dispute was settled", body: "Shoal settled the dispute. Open the job to see how the deposit was shared." },
  },
};

/** A job state mail (lib/jobs/state.ts effects); null when the template says nothing to this recipient. */
export function jobStateMail(template: JobMailTemplate, to: JobMailRecipient, data: { name: string; url: string }): RenderedMail | null {
  const text = JOB_TEXT[template][to];
  if (!text) return null;
  return composeMail(`${template}-${to}`, text.subject, text.title, [`Hello ${data.name},`, text.body], { label: "Open the job", url: data.url });
}
