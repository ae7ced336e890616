import { formatMoney, isCurrencyCode } from "@/lib/money/money";

/*
 * Double-entry book of held money. Every amount is an integer count of the currency's minor unit with an
 * upper-case ISO 4217 code (lib/money/money.ts). Each movement writes balanced legs: money leaves one
 * account (negative leg) and arrives in another (positive leg), so a hold's entries always sum to zero.
 *
 * Four accounts, one per party that can be owed money:
 * - farmer_funds:     the payer's side. It goes negative by what the farmer paid in and back towards zero
 *                     by what is returned, so −balance is "the farmer's money still out of their hands".
 * - platform_holding: money Shoal holds and owes to nobody yet (the deposit between hold and settlement).
 * - provider_payable: money settled to the hatchery or builder, awaiting payout.
 * - platform_fee:     Shoal's revenue.
 * There is no separate "refunds" account: a refund is held money going back where it came from, so it
 * lands in farmer_funds; a refunds account would show money as both returned and still owed. Refund
 * totals are read from the entries' movement kind instead.
 *
 * Platform fee: the ledger can book one (provider_payable → platform_fee), but Shoal charges none yet —
 * DESIGN.md and issue 4 describe no fee — so no machine emits a fee movement and there is no fee rate.
 */

export const LEDGER_ACCOUNTS = ["farmer_funds", "platform_holding", "provider_payable", "platform_fee"] as const;
export type LedgerAccount = (typeof LEDGER_ACCOUNTS)[number];

/** Names for the admin ledger page. */
export const LEDGER_ACCOUNT_LABELS: Readonly<Record<LedgerAccount, string>> = {
  farmer_funds: "Farmer's funds",
  platform_holding: "Held by Shoal",
  provider_payable: "Owed to provider",
  platform_fee: "Shoal fee",
};

export type LedgerMovement =
  /** the deposit is authorised: farmer_funds → platform_holding */
  | { kind: "hold"; holdId: string; currency: string; amountMinor: number }
  /**
   * settlement to the provider: platform_holding → provider_payable; a partial release also returns
   * `returnMinor` (platform_holding → farmer_funds) in the same movement, since both happen in one capture
   */
  | { kind: "release"; holdId: string; currency: string; releaseMinor: number; returnMinor: number }
  /** all that is still held goes back: platform_holding → farmer_funds */
  | { kind: "refund"; holdId: string; currency: string; amountMinor: number }
  /** Shoal's fee out of a released amount: provider_payable → platform_fee (not used yet, see above) */
  | { kind: "fee"; holdId: string; currency: string; amountMinor: number };

export type LedgerMovementKind = LedgerMovement["kind"];

export interface LedgerEntry {
  /**
   * `${holdId}:${kind}`. A hold is held once and settles once (released, refunded or expired are final), so
   * each kind occurs at most once per hold: the id can carry a unique index and doubles as an idempotency key.
   */
  movementId: string;
  holdId: string;
  movement: LedgerMovementKind;
  /** position of the leg inside its movement */
  leg: number;
  account: LedgerAccount;
  currency: string;
  /** signed: positive is money arriving in the account, negative money leaving it */
  amountMinor: number;
}

export function movementId(holdId: string, kind: LedgerMovementKind): string {
  return `${holdId}:${kind}`;
}

function requireMinor(value: number, what: string, allowZero: boolean): void {
  if (!Number.isSafeInteger(value) || value < 0 || (!allowZero && value === 0)) {
    throw new RangeError(`${what} must be a ${allowZero ? "non-negative" : "positive"} integer count of minor units, got ${value}`);
  }
}

/** Balanced legs for one movement: pairs of (−amount from, +amount to). */
export function entriesFor(movement: LedgerMovement): LedgerEntry[] {
  if (!movement.holdId) throw new RangeError("A movement needs a hold id");
  if (!isCurrencyCode(movement.currency)) throw new RangeError(`Not an ISO 4217 currency code: ${movement.currency}`);
  const id = movementId(movement.holdId, movement.kind);
  const legs: Array<[LedgerAccount, number]> = [];
  const pair = (from: LedgerAccount, to: LedgerAccount, amountMinor: number) => {
    legs.push([from, -amountMinor], [to, amountMinor]);
  };
  switch (movement.kind) {
    case "hold":
      requireMinor(movement.amountMinor, "A hold", false);
      pair("farmer_funds", "platform_holding", movement.amountMinor);
      break;
    case "release":
      requireMinor(movement.releaseMinor, "A release", false);
      requireMinor(movement.returnMinor, "The returned part of a release", true);
      pair("platform_holding", "provider_payable", movement.releaseMinor);
      if (movement.returnMinor > 0) pair("platform_holding", "farmer_funds", movement.returnMinor);
      break;
    case "refund":
      requireMinor(movement.amountMinor, "A refund", false);
      pair("platform_holding", "farmer_funds", movement.amountMinor);
      break;
    case "fee":
      requireMinor(movement.amountMinor, "A fee", false);
      pair("provider_payable", "platform_fee", movement.amountMinor);
      break;
  }
  return legs.map(([account, amountMinor], leg) => ({
    movementId: id,
    holdId: movement.holdId,
    movement: movement.kind,
    leg,
    account,
    currency: movement.currency,
    amountMinor,
  }));
}

export type Balances = Record<string, Record<LedgerAccount, number>>;

function zeroAccounts(): Record<LedgerAccount, number> {
  return { farmer_funds: 0, platform_holding: 0, provider_payable: 0, platform_fee: 0 };
}

/** Account balances per currency code (never summed across currencies). */
export function balances(entries: readonly LedgerEntry[]): Balances {
  const out: Balances = {};
  for (const e of entries) {
    const accounts = (out[e.currency] ??= zeroAccounts());
    accounts[e.account] += e.amountMinor;
  }
  return out;
}

export type LedgerProblem =
  | { kind: "bad_amount"; movementId: string; leg: number; amountMinor: number }
  | { kind: "bad_currency"; movementId: string; currency: string }
  | { kind: "duplicate_leg"; movementId: string; leg: number }
  | { kind: "unbalanced_movement"; movementId: string; currency: string; sumMinor: number }
  | { kind: "mixed_currency"; holdId: string; currencies: string[] }
  | { kind: "unbalanced_hold"; holdId: string; currency: string; sumMinor: number }
  | { kind: "overdrawn_holding"; holdId: string; movementId: string; balanceMinor: number };

/**
 * Every broken invariant, in the order the entries are given (which must be the order they were written):
 * integer non-zero legs, valid ISO 4217 codes, no leg written twice, every movement and every hold summing
 * to zero per currency, one currency per hold, and a hold never paying out more than was held.
 */
export function ledgerProblems(entries: readonly LedgerEntry[]): LedgerProblem[] {
  const problems: LedgerProblem[] = [];
  const seenLegs = new Set<string>();
  const movementSums = new Map<string, { currency: string; sum: number }>();
  const holdSums = new Map<string, Map<string, number>>();
  const holding = new Map<string, number>();

  for (const e of entries) {
    if (!Number.isSafeInteger(e.amountMinor) || e.amountMinor === 0) {
      problems.push({ kind: "bad_amount", movementId: e.movementId, leg: e.leg, amountMinor: e.amountMinor });
    }
    if (!isCurrencyCode(e.currency)) problems.push({ kind: "bad_currency", movementId: e.movementId, currency: e.currency });
    const legKey = `${e.movementId}#${e.leg}`;
    if (seenLegs.has(legKey)) problems.push({ kind: "duplicate_leg", movementId: e.movementId, leg: e.leg });
    seenLegs.add(legKey);

    const movementKey = `${e.movementId}|${e.currency}`;
    const m = movementSums.get(movementKey) ?? { currency: e.currency, sum: 0 };
    m.sum += e.amountMinor;
    movementSums.set(movementKey, m);

    const perCurrency = holdSums.get(e.holdId) ?? new Map<string, number>();
    perCurrency.set(e.currency, (perCurrency.get(e.currency) ?? 0) + e.amountMinor);
    holdSums.set(e.holdId, perCurrency);

    if (e.account === "platform_holding") {
      // Per currency: ZMW held does not cover USD paid out.
      const holdingKey = `${e.holdId}|${e.currency}`;
      const balance = (holding.get(holdingKey) ?? 0) + e.amountMinor;
      holding.set(holdingKey, balance);
      if (balance < 0) problems.push({ kind: "overdrawn_holding", holdId: e.holdId, movementId: e.movementId, balanceMinor: balance });
    }
  }
  for (const [key, { currency, sum }] of movementSums) {
    if (sum !== 0) problems.push({ kind: "unbalanced_movement", movementId: key.slice(0, key.lastIndexOf("|")), currency, sumMinor: sum });
  }
  for (const [holdId, perCurrency] of holdSums) {
    if (perCurrency.size > 1) problems.push({ kind: "mixed_currency", holdId, currencies: [...perCurrency.keys()].sort() });
    for (const [currency, sum] of perCurrency) {
      if (sum !== 0) problems.push({ kind: "unbalanced_hold", holdId, currency, sumMinor: sum });
    }
  }
  return problems;
}

export class LedgerInvariantError extends Error {
  constructor(readonly problems: readonly LedgerProblem[]) {
    super(`Ledger invariants broken: ${problems.map((p) => p.kind).join(", ")}`);
    this.name = "LedgerInvariantError";
  }
}

/** Throws LedgerInvariantError naming every broken invariant (see ledgerProblems). */
export function assertBalanced(entries: readonly LedgerEntry[]): void {
  const problems = ledgerProblems(entries);
  if (problems.length > 0) throw new LedgerInvariantError(problems);
}

/** One line for the admin ledger: the account's label and the signed amount, formatted by formatMoney. */
export function formatEntry(entry: LedgerEntry, locale?: string): string {
  return `${LEDGER_ACCOUNT_LABELS[entry.account]} ${formatMoney(entry.amountMinor, entry.currency, locale)}`;
}

export type MinorRounding = "half_up" | "down";

/**
 * amountMinor × numerator ÷ denominator, as an integer count of minor units. Exact (BigInt), so a price
 * times a share in basis points cannot lose a unit to binary floating point. "half_up" rounds a fraction of
 * exactly one half up (all inputs are non-negative, so up is away from zero); "down" drops the fraction.
 * Used for the part of a hold that moves: a deposit share, a pro-rated release.
 */
export function scaleMinor(amountMinor: number, numerator: number, denominator: number, rounding: MinorRounding): number {
  for (const [value, what] of [
    [amountMinor, "amount"],
    [numerator, "numerator"],
    [denominator, "denominator"],
  ] as const) {
    if (!Number.isSafeInteger(value) || value < 0) throw new RangeError(`scaleMinor: ${what} must be a non-negative integer, got ${value}`);
  }
  if (denominator === 0) throw new RangeError("scaleMinor: denominator must be positive");
  const product = BigInt(amountMinor) * BigInt(numerator);
  const d = BigInt(denominator);
  const quotient = rounding === "half_up" ? (product * 2n + d) / (2n * d) : product / d;
  const result = Number(quotient);
  if (!Number.isSafeInteger(result)) throw new RangeError("scaleMinor: result is too large for a safe integer");
  return result;
}
