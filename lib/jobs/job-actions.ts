import { JOB_RULES, type JobEventType } from "./state";
import type { JobRowState } from "./vocabulary";

/* Which buttons a job page shows, from the same rules the machine enforces (state.ts JOB_RULES). */

export type JobButton = "arrive" | "mark_built" | "confirm" | "dispute" | "cancel" | "resolve";
const BUTTONS: readonly JobButton[] = ["arrive", "mark_built", "confirm", "dispute", "cancel", "resolve"];

export function jobButtons(state: JobRowState, role: "farmer" | "builder" | "admin"): JobButton[] {
  // Before the deposit either side may call the job off; nothing else moves until it is paid.
  if (state === "awaiting_deposit") return role === "admin" ? [] : ["cancel"];
  return BUTTONS.filter((b) => {
    const allowed = JOB_RULES[b satisfies JobEventType][state];
    return allowed?.includes(role) ?? false;
  });
}

export const JOB_EVENT_LABEL: Record<string, string> = {
  accept_quote: "Quote accepted",
  deposit_held: "Deposit held by Shoal",
  arrive: "Builder on site",
  mark_built: "Tank built, photos added",
  confirm: "Farmer confirmed: deposit released",
  auto_confirm: "Confirmed automatically after a week: deposit released",
  dispute: "Dispute opened: deposit frozen",
  resolve: "Dispute settled",
  cancel: "Job cancelled",
};
