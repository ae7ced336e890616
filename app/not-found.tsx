import { ButtonLink } from "@/components/ui/button";

export default function NotFound() {
  return (
    <div className="mx-auto max-w-xl px-4 py-16 text-center">
      <p className="text-sm font-semibold uppercase tracking-wider text-reed-700">404</p>
      <h1 className="mt-2 text-2xl font-semibold text-silt-950">We could not find that page</h1>
      <p className="mt-2 text-silt-700">The link may be old, or the listing may have been taken down.</p>
      <div className="mt-6">
        <ButtonLink href="/">Back to the start</ButtonLink>
      </div>
    </div>
  );
}
