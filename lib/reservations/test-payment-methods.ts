/**
 * The stand-in's test cards (docs.stripe.com/testing); a live deployment gets a token from the card form instead.
 * Apart from the zod schemas (lib/validations/reservations.ts) so that the deposit form loads no validation code.
 */
export const TEST_PAYMENT_METHODS = [
  { id: "pm_card_visa", label: "Test card that pays (Visa ending 4242)" },
  { id: "pm_card_chargeDeclined", label: "Test card that is declined (ending 0002)" },
  { id: "pm_card_chargeDeclinedInsufficientFunds", label: "Test card with too little money (ending 9995)" },
] as const;
