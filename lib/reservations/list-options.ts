// The reservation list's filters and sort keys, apart from the zod schema that parses them
// (lib/validations/reservations.ts): the hatchery's table names them in the browser and needs no validation code.

// "attention": what needs the viewer first (a deposit to pay, a survival report due), then the rest, newest first.
export const RESERVATION_SORTS = ["requestedAt", "count", "state", "total", "attention"] as const;
export const RESERVATION_FILTERS = ["all", "open", "requested", "accepted", "deposit_held", "quarantine", "disputed", "done"] as const;
