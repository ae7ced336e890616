import type { ReactNode } from "react";

export function Card({ children, className = "" }: { children: ReactNode; className?: string }) {
  return <section className={`rounded-card border border-silt-200 bg-white p-5 shadow-card ${className}`}>{children}</section>;
}

export function PageHeading({ title, lead, children }: { title: string; lead?: ReactNode; children?: ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1 className="text-2xl font-semibold text-silt-950 sm:text-3xl">{title}</h1>
        {lead ? <p className="mt-1 max-w-2xl text-silt-700">{lead}</p> : null}
      </div>
      {children}
    </div>
  );
}
