import { ButtonLink } from "@/components/ui/button";

export default function PlanNotFound() {
  return (
    <div className="mx-auto max-w-xl px-4 py-16 text-center">
      <p className="text-sm font-semibold uppercase tracking-wider text-reed-700">404</p>
      <h1 className="mt-2 text-2xl font-semibold text-silt-950">We could not find that plan</h1>
      <p className="mt-2 text-silt-700">The link may be mistyped, or the farmer who saved it has deleted it.</p>
      <div className="mt-6">
        <ButtonLink href="/planner">Plan a tank of your own</ButtonLink>
      </div>
    </div>
  );
}
