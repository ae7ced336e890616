"use client";
import Link from "next/link";
import { useEffect, useState } from "react";
import { Button, ButtonLink } from "@/components/ui/button";
import { describedBy, Field, FormError, FormNotice, Input } from "@/components/ui/field";
import { postJson, putJson } from "@/lib/api/client";
import { PLAN_NAME_MAX_LENGTH, type PlanInput } from "@/lib/validations/planner";

export interface SavedPlanRef {
  id: string;
  name: string;
  owned: boolean;
}

export interface Viewer {
  signedIn: boolean;
  canSave: boolean;
}

type SaveReply = { plan: { id: string; name: string } };

/** Save, share and print. Signed-out visitors are invited to sign in; their draft waits on this device meanwhile. */
export function SavePanel({
  viewer,
  saved,
  onSaved,
  input,
  suggestedName,
}: {
  viewer: Viewer;
  saved: SavedPlanRef | null;
  onSaved: (plan: SavedPlanRef) => void;
  /** null while a field is not valid: nothing is saved until it is. */
  input: PlanInput | null;
  suggestedName: string;
}) {
  const [typedName, setTypedName] = useState<string | null>(saved?.name ?? null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [origin, setOrigin] = useState("");
  const [copied, setCopied] = useState<string | null>(null);
  useEffect(() => setOrigin(window.location.origin), []);

  const name = typedName ?? suggestedName;
  const planPath = saved ? `/plans/${saved.id}` : null;
  const returnTo = saved ? `/planner?from=${saved.id}` : "/planner";

  async function save(asNew: boolean) {
    if (!input) return;
    setBusy(true);
    setMessage(null);
    const body = { name, input };
    const result = !asNew && saved?.owned ? await putJson<SaveReply>(`/api/v1/plans/${saved.id}`, body) : await postJson<SaveReply>("/api/v1/plans", body);
    setBusy(false);
    if (!result.ok) {
      const nameError = result.fieldErrors?.name?.[0];
      setMessage({ ok: false, text: result.status === 401 ? "Your session has ended. Sign in again to save; your plan stays on this device." : (nameError ?? result.message) });
      return;
    }
    onSaved({ id: result.data.plan.id, name: result.data.plan.name, owned: true });
    setTypedName(result.data.plan.name);
    setMessage({ ok: true, text: asNew || !saved?.owned ? "Saved. Anyone with the link below can read this plan." : "Changes saved." });
  }

  async function copy(url: string) {
    try {
      await navigator.clipboard.writeText(url);
      setCopied("Link copied.");
    } catch (error) {
      console.warn("[planner] clipboard refused", error);
      setCopied("Select the link to copy it.");
    }
  }

  return (
    <section aria-labelledby="save-heading" className="no-print rounded-card border border-lagoon-200 bg-lagoon-50 p-4 sm:p-5">
      <h2 id="save-heading" className="text-lg font-semibold text-silt-950">
        Save and share
      </h2>
      {!viewer.signedIn ? (
        <div className="mt-2 space-y-3 text-sm text-silt-800">
          <p>Sign in as a farmer to save this plan and share it by link. What you typed stays on this device while you sign in.</p>
          <div className="flex flex-wrap gap-2">
            <ButtonLink href={`/sign-in?next=${encodeURIComponent(returnTo)}`}>Sign in to save</ButtonLink>
            <ButtonLink href="/sign-up" variant="secondary">
              Create a free account
            </ButtonLink>
          </div>
        </div>
      ) : !viewer.canSave ? (
        <p className="mt-2 text-sm text-silt-800">
          Saving plans is part of a farmer account. You can add farming to your account on{" "}
          <Link href="/onboarding" className="font-medium text-lagoon-700 underline underline-offset-2">
            your profile
          </Link>
          .
        </p>
      ) : (
        <form
          className="mt-3 space-y-3"
          onSubmit={(e) => {
            e.preventDefault();
            void save(false);
          }}
        >
          <Field id="plan-name" label="Plan name">
            <Input id="plan-name" value={name} maxLength={PLAN_NAME_MAX_LENGTH} onChange={(e) => setTypedName(e.target.value)} aria-describedby={describedBy("plan-name")} />
          </Field>
          {message ? message.ok ? <FormNotice>{message.text}</FormNotice> : <FormError message={message.text} /> : null}
          {!input ? <p className="text-sm text-clay-700">Fix the marked fields before saving.</p> : null}
          <div className="flex flex-wrap gap-2">
            <Button type="submit" disabled={busy || !input || !name.trim()}>
              {busy ? "Saving…" : saved?.owned ? "Save changes" : "Save plan"}
            </Button>
            {saved?.owned ? (
              <Button type="button" variant="secondary" disabled={busy || !input || !name.trim()} onClick={() => void save(true)}>
                Save as a new plan
              </Button>
            ) : null}
          </div>
        </form>
      )}
      {planPath && saved?.owned ? (
        <div className="mt-3 space-y-1 text-sm">
          <p className="font-medium text-silt-800">Link to share</p>
          <p className="flex flex-wrap items-center gap-2">
            <Link href={planPath} className="break-all font-medium text-lagoon-700 underline underline-offset-2" data-testid="plan-link">
              {`${origin}${planPath}`}
            </Link>
            <Button type="button" variant="ghost" className="min-h-9 px-2 py-1" onClick={() => void copy(`${origin}${planPath}`)}>
              Copy link
            </Button>
          </p>
          {copied ? <p role="status" className="text-xs text-silt-700">{copied}</p> : null}
        </div>
      ) : null}
      <div className="mt-3">
        <Button type="button" variant="secondary" onClick={() => window.print()}>
          Print the figures
        </Button>
      </div>
    </section>
  );
}
