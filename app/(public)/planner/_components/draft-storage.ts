import * as z from "zod/mini";
import { planDraftSchema, type PlanDraft } from "@/lib/plans/plan-draft";

/*
 * The planner's draft on this device, so nothing typed is lost: while signing in to save, on a reload, or when the
 * connection drops. Only the form's own text is kept, never anything about the account.
 */

const KEY = "shoal.planner.draft";

const storedSchema = z.object({ draft: planDraftSchema, fromPlanId: z.nullable(z.string().check(z.maxLength(64))) });

export interface StoredDraft {
  draft: PlanDraft;
  /** The saved plan the draft started from, if any. */
  fromPlanId: string | null;
}

export function loadStoredDraft(): StoredDraft | null {
  let raw: string | null;
  try {
    raw = window.localStorage.getItem(KEY);
  } catch (error) {
    // Storage can be switched off (private browsing, site data blocked): the planner still works, it just forgets.
    console.warn("[planner] cannot read the saved draft", error);
    return null;
  }
  if (!raw) return null;
  let json: unknown;
  try {
    json = JSON.parse(raw);
  } catch {
    return null; // Not ours or damaged: start from the defaults.
  }
  const parsed = storedSchema.safeParse(json);
  return parsed.success ? parsed.data : null;
}

/** False when the device will not keep it, so the page can say so. */
export function storeDraft(stored: StoredDraft): boolean {
  try {
    window.localStorage.setItem(KEY, JSON.stringify(stored));
    return true;
  } catch (error) {
    console.warn("[planner] cannot keep the draft on this device", error);
    return false;
  }
}

export function clearStoredDraft(): void {
  try {
    window.localStorage.removeItem(KEY);
  } catch (error) {
    console.warn("[planner] cannot clear the saved draft", error);
  }
}
