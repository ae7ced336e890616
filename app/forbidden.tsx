import { ButtonLink } from "@/components/ui/button";

export default function Forbidden() {
  return (
    <div className="mx-auto max-w-xl px-4 py-16 text-center">
      <p className="text-sm font-semibold uppercase tracking-wider text-reed-700">403 · Not for your account</p>
      <h1 className="mt-2 text-2xl font-semibold text-silt-950">This part of Shoal is for another role</h1>
      <p className="mt-2 text-silt-700">
        Your account does not have the role this page needs. If you also build tanks or run a hatchery, add that role to your profile.
      </p>
      <div className="mt-6 flex justify-center gap-3">
        <ButtonLink href="/dashboard">My Shoal</ButtonLink>
        <ButtonLink href="/onboarding" variant="secondary">
          Add a role
        </ButtonLink>
      </div>
    </div>
  );
}
