"use client";
import { keepPreviousData, useQuery, useQueryClient } from "@tanstack/react-query";
import dynamic from "next/dynamic";
import Link from "next/link";
import { useEffect, useMemo, useState } from "react";
import { ReservationStatus } from "@/components/reservations/status-badge";
import { Button } from "@/components/ui/button";
import { FormError, inputClass } from "@/components/ui/field";
import { getJson, postJson } from "@/lib/api/client";
import { SPECIES_LABEL } from "@/lib/catalog";
import { formatMoney } from "@/lib/money/money";
import { formatDateTime } from "@/lib/reservations/labels";
import type { ReservationPage, ReservationSummary } from "@/lib/reservations/queries";
import type { OwnBatch } from "@/lib/reservations/batches";
import { RESERVATION_FILTERS, RESERVATION_SORTS } from "@/lib/reservations/list-options";

// The hand-over form (react-hook-form and its zod schema, about 30 KB gzipped) loads when "Hand over" is pressed,
// not with the table: most visits answer requests or read the list.
const HandOverForm = dynamic(() => import("./hand-over-form").then((m) => m.HandOverForm), {
  loading: () => (
    <p role="status" className="text-sm text-silt-600">
      Opening the hand-over form…
    </p>
  ),
});

type Filter = (typeof RESERVATION_FILTERS)[number];
type Sort = (typeof RESERVATION_SORTS)[number];

const FILTER_LABEL: Record<Filter, string> = {
  all: "All",
  open: "Open",
  requested: "Waiting for your answer",
  accepted: "Waiting for the deposit",
  deposit_held: "Deposit held",
  quarantine: "In quarantine week",
  disputed: "Disputed",
  done: "Finished",
};
const SORT_LABEL: Record<Sort, string> = { requestedAt: "Requested", count: "Fish", total: "Total", state: "Status", attention: "Your next step" };

async function fetchOrThrow<T>(url: string): Promise<T> {
  const r = await getJson<T>(url);
  if (!r.ok) throw new Error(r.message);
  return r.data;
}

export function ReservationTable({ initialBatchId }: { initialBatchId: string | null }) {
  const queryClient = useQueryClient();
  const [state, setState] = useState<Filter>(initialBatchId ? "all" : "open");
  const [batchId, setBatchId] = useState(initialBatchId ?? "");
  const [search, setSearch] = useState("");
  const [q, setQ] = useState("");
  const [sort, setSort] = useState<Sort>("requestedAt");
  const [dir, setDir] = useState<"asc" | "desc">("desc");
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(10);
  const [handingOver, setHandingOver] = useState<string | null>(null);
  const [rowError, setRowError] = useState<{ id: string; message: string } | null>(null);
  const [busy, setBusy] = useState<string | null>(null);

  useEffect(() => {
    const t = setTimeout(() => {
      setQ(search.trim());
      setPage(1);
    }, 300);
    return () => clearTimeout(t);
  }, [search]);

  const params = useMemo(() => {
    const p = new URLSearchParams({ as: "hatchery", state, sort, dir, page: String(page), pageSize: String(pageSize) });
    if (batchId) p.set("batchId", batchId);
    if (q) p.set("q", q);
    return p;
  }, [state, sort, dir, page, pageSize, batchId, q]);
  const exportParams = new URLSearchParams(params);
  exportParams.delete("page");
  exportParams.delete("pageSize");
  exportParams.delete("as");

  const list = useQuery({ queryKey: ["reservations", params.toString()], queryFn: () => fetchOrThrow<ReservationPage>(`/api/v1/reservations?${params}`), placeholderData: keepPreviousData });
  const batches = useQuery({ queryKey: ["own-batches"], queryFn: () => fetchOrThrow<{ batches: OwnBatch[] }>("/api/v1/batches") });

  const refresh = () => queryClient.invalidateQueries({ queryKey: ["reservations"] });

  async function act(row: ReservationSummary, action: "accept" | "decline") {
    if (action === "decline" && !window.confirm(`Decline ${row.farmerName}'s reservation of ${row.count} fish? The fish go back on offer.`)) return;
    setBusy(row.id);
    setRowError(null);
    const result = await postJson(`/api/v1/reservations/${row.id}/actions`, { action });
    setBusy(null);
    if (!result.ok) setRowError({ id: row.id, message: result.message });
    await refresh();
  }

  function sortBy(column: Sort) {
    if (sort === column) setDir(dir === "asc" ? "desc" : "asc");
    else {
      setSort(column);
      setDir(column === "requestedAt" ? "desc" : "asc");
    }
    setPage(1);
  }

  const header = (column: Sort) => (
    <th scope="col" aria-sort={sort === column ? (dir === "asc" ? "ascending" : "descending") : "none"} className="py-2 pr-3 font-medium">
      <button type="button" onClick={() => sortBy(column)} className="inline-flex min-h-11 items-center gap-1 hover:text-lagoon-700">
        {SORT_LABEL[column]}
        <span aria-hidden="true">{sort === column ? (dir === "asc" ? "▲" : "▼") : "↕"}</span>
      </button>
    </th>
  );

  const actions = (row: ReservationSummary, prefix: string) => (
    <div className="flex flex-wrap gap-2">
      {row.allowed.includes("accept") ? (
        <Button disabled={busy === row.id} onClick={() => act(row, "accept")} aria-label={`Accept ${row.reference}`}>
          Accept
        </Button>
      ) : null}
      {row.allowed.includes("decline") ? (
        <Button variant="secondary" disabled={busy === row.id} onClick={() => act(row, "decline")} aria-label={`Decline ${row.reference}`}>
          Decline
        </Button>
      ) : null}
      {row.allowed.includes("hand_over") && handingOver !== row.id ? (
        <Button variant="secondary" onClick={() => setHandingOver(row.id)} aria-label={`Record hand-over for ${row.reference}`}>
          Hand over
        </Button>
      ) : null}
      {handingOver === row.id ? (
        <HandOverForm
          reservationId={row.id}
          reserved={row.count}
          idPrefix={prefix}
          onDone={() => {
            setHandingOver(null);
            void refresh();
          }}
        />
      ) : null}
      {rowError?.id === row.id ? <FormError message={rowError.message} /> : null}
    </div>
  );

  const data = list.data;
  return (
    <div className="space-y-4">
      <div className="grid gap-3 rounded-card border border-silt-200 bg-white p-4 sm:grid-cols-2 lg:grid-cols-4">
        <label className="text-sm font-medium text-silt-800">
          Status
          <select className={`${inputClass} mt-1`} value={state} onChange={(e) => { setState(e.target.value as Filter); setPage(1); }}>
            {RESERVATION_FILTERS.map((f) => (
              <option key={f} value={f}>
                {FILTER_LABEL[f]}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm font-medium text-silt-800">
          Batch
          <select className={`${inputClass} mt-1`} value={batchId} onChange={(e) => { setBatchId(e.target.value); setPage(1); }}>
            <option value="">All batches</option>
            {batches.data?.batches.map((b) => (
              <option key={b.id} value={b.id}>
                {SPECIES_LABEL[b.species]} {b.meanWeightG} g ({b.state})
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm font-medium text-silt-800">
          Search
          <input className={`${inputClass} mt-1`} type="search" placeholder="Farmer or reference" value={search} onChange={(e) => setSearch(e.target.value)} />
        </label>
        <div className="flex items-end">
          <a href={`/api/v1/reservations/export?${exportParams}`} className="inline-flex min-h-11 w-full items-center justify-center rounded-lg border border-silt-300 bg-white px-4 text-sm font-semibold text-silt-900 hover:bg-silt-100" download>
            Export CSV
          </a>
        </div>
      </div>

      {list.isError ? (
        <div role="alert" className="flex flex-wrap items-center justify-between gap-3 rounded-card border border-clay-500/30 bg-clay-50 p-4 text-sm text-clay-700">
          <p>Could not load reservations: {list.error.message}</p>
          <Button type="button" variant="secondary" disabled={list.isFetching} onClick={() => void list.refetch()}>
            {list.isFetching ? "Trying…" : "Try again"}
          </Button>
        </div>
      ) : null}

      {list.isPending && list.fetchStatus === "paused" ? (
        // TanStack Query holds the request while the browser is offline and sends it when the connection returns.
        <p role="status" className="rounded-card border border-reed-300 bg-reed-50 p-4 text-sm text-reed-900">
          You are offline. The reservations load as soon as the connection is back.
        </p>
      ) : list.isPending ? (
        <div role="status" aria-busy="true" className="space-y-2" data-testid="reservations-skeleton">
          <span className="sr-only">Loading reservations…</span>
          {[0, 1, 2].map((i) => (
            <div key={i} aria-hidden="true" className="h-14 animate-pulse rounded-lg bg-silt-200" />
          ))}
        </div>
      ) : data && data.rows.length === 0 ? (
        <p className="rounded-card border border-silt-200 bg-white p-5 text-silt-700">No reservations match.</p>
      ) : data ? (
        <>
          {/* Phones: one card per reservation. */}
          <ul className="space-y-3 sm:hidden" aria-label="Reservations">
            {data.rows.map((row) => (
              <li key={row.id} className="space-y-2 rounded-card border border-silt-200 bg-white p-4">
                <div className="flex items-start justify-between gap-2">
                  <Link href={`/hatchery/reservations/${row.id}`} className="font-semibold text-lagoon-700 underline underline-offset-2">
                    {row.farmerName}
                  </Link>
                  <ReservationStatus state={row.state} viewer="hatchery" />
                </div>
                <p className="text-sm text-silt-700">
                  {row.count.toLocaleString("en")} {row.speciesLabel} · {formatMoney(row.totalMinor, row.currency)} · {row.handoverMethod === "pickup" ? "collects" : "delivery"}
                </p>
                <p className="text-xs text-silt-600">
                  {row.reference} · requested {formatDateTime(row.requestedAt)}
                </p>
                {actions(row, "m-handover")}
              </li>
            ))}
          </ul>
          {/* Wider screens: a sortable table. */}
          <div className="hidden overflow-x-auto rounded-card border border-silt-200 bg-white sm:block">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">Incoming reservations, sorted by {SORT_LABEL[sort].toLowerCase()}</caption>
              <thead className="border-b border-silt-200 text-silt-600">
                <tr>
                  <th scope="col" className="py-2 pl-4 pr-3 font-medium">
                    Farmer
                  </th>
                  {header("requestedAt")}
                  {header("count")}
                  {header("total")}
                  {header("state")}
                  <th scope="col" className="py-2 pr-4 font-medium">
                    Next step
                  </th>
                </tr>
              </thead>
              <tbody className="divide-y divide-silt-100">
                {data.rows.map((row) => (
                  <tr key={row.id} className="align-top">
                    <td className="py-3 pl-4 pr-3">
                      <Link href={`/hatchery/reservations/${row.id}`} className="font-medium text-lagoon-700 underline underline-offset-2">
                        {row.farmerName}
                      </Link>
                      <span className="block text-xs text-silt-600">
                        {row.reference} · {row.speciesLabel} {row.meanWeightG} g · {row.handoverMethod === "pickup" ? "collects" : "delivery"}
                      </span>
                    </td>
                    <td className="py-3 pr-3 whitespace-nowrap">{formatDateTime(row.requestedAt)}</td>
                    <td className="py-3 pr-3">
                      {row.count.toLocaleString("en")}
                      {row.handedOverCount !== null ? <span className="block text-xs text-silt-600">{row.handedOverCount} handed over</span> : null}
                    </td>
                    <td className="py-3 pr-3 whitespace-nowrap">{formatMoney(row.totalMinor, row.currency)}</td>
                    <td className="py-3 pr-3">
                      <ReservationStatus state={row.state} viewer="hatchery" />
                      {row.nextDeadline ? <span className="mt-1 block text-xs text-silt-600">until {formatDateTime(row.nextDeadline)}</span> : null}
                    </td>
                    <td className="py-3 pr-4">{actions(row, "t-handover")}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <nav className="flex flex-wrap items-center justify-between gap-3 text-sm" aria-label="Pages">
            <p className="text-silt-700" aria-live="polite">
              {data.total.toLocaleString("en")} reservation{data.total === 1 ? "" : "s"} · page {data.page} of {data.pages}
              {list.isFetching ? " · updating…" : ""}
            </p>
            <div className="flex items-center gap-2">
              <label className="flex items-center gap-2">
                <span className="whitespace-nowrap text-silt-700">Per page</span>
                <select className={`${inputClass} w-20`} value={pageSize} onChange={(e) => { setPageSize(Number(e.target.value)); setPage(1); }}>
                  {[10, 25, 50].map((n) => (
                    <option key={n} value={n}>
                      {n}
                    </option>
                  ))}
                </select>
              </label>
              <Button variant="secondary" disabled={data.page <= 1} onClick={() => setPage(data.page - 1)}>
                Previous
              </Button>
              <Button variant="secondary" disabled={data.page >= data.pages} onClick={() => setPage(data.page + 1)}>
                Next
              </Button>
            </div>
          </nav>
        </>
      ) : null}
    </div>
  );
}
