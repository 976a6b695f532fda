import { z } from 'zod';

export const BILLING_INTERVALS = ['monthly', 'yearly'] as const;
export const billingIntervalSchema = z.enum(BILLING_INTERVALS);
export type BillingInterval = z.infer<typeof billingIntervalSchema>;

export const MAX_SEATS = 500;
const seatsSchema = z
  .number({ error: 'Enter a number of seats.' })
  .int({ error: 'Seats are whole numbers.' })
  .min(1, { error: 'Buy at least 1 seat.' })
  .max(MAX_SEATS, { error: `At most ${MAX_SEATS} seats; write to us for more.` });

export const checkoutRequestSchema = z.object({ seats: seatsSchema, interval: billingIntervalSchema });
export type CheckoutRequest = z.infer<typeof checkoutRequestSchema>;
export const checkoutReplySchema = z.object({ url: z.string() });

export const resizeRequestSchema = z.object({ seats: seatsSchema });
export type ResizeRequest = z.infer<typeof resizeRequestSchema>;

/** What a seat change would cost, from the payment service's invoice preview, before anything changes. */
export const seatChangePreviewSchema = z.object({
  seats: z.number().int(),
  currentSeats: z.number().int(),
  /** More seats are charged at once; fewer are credited on the next invoice. */
  chargedNow: z.boolean(),
  /** The prorated amount in the currency's smallest unit: charged now (> 0) or credited (< 0). */
  prorationAmount: z.number().int(),
  /** Due now when charged now, otherwise on the next invoice, after any credit. */
  amountDue: z.number().int(),
  currency: z.string(),
  /** When the next invoice falls due (the end of the paid period). */
  nextInvoiceAt: z.string().nullable(),
});
export type SeatChangePreview = z.infer<typeof seatChangePreviewSchema>;

export const SUBSCRIPTION_STATUSES = ['active', 'past_due', 'canceled'] as const;

export const subscriptionSchema = z.object({
  status: z.enum(SUBSCRIPTION_STATUSES),
  seats: z.number().int(),
  interval: billingIntervalSchema.nullable(),
  currentPeriodEnd: z.string().nullable(),
  cancelAtPeriodEnd: z.boolean(),
});
export type Subscription = z.infer<typeof subscriptionSchema>;

export const planSchema = z.object({
  interval: billingIntervalSchema,
  unitAmount: z.number().int(),
  currency: z.string(),
});
export type Plan = z.infer<typeof planSchema>;

export const seatUsageSchema = z.object({
  /** Seats paid for by an active subscription (0 without one). */
  paid: z.number().int(),
  /** Admin, consultant and scientist members, active or invited. */
  inUse: z.number().int(),
  /** Runs and paid members need an active subscription. */
  active: z.boolean(),
});
export type SeatUsage = z.infer<typeof seatUsageSchema>;

export const billingSummarySchema = z.object({
  subscription: subscriptionSchema.nullable(),
  seats: seatUsageSchema,
});
export type BillingSummary = z.infer<typeof billingSummarySchema>;

export const plansReplySchema = z.object({ plans: z.array(planSchema) });

export const invoiceSchema = z.object({
  id: z.string(),
  number: z.string().nullable(),
  createdAt: z.string(),
  status: z.string(),
  reason: z.string().nullable(),
  amountDue: z.number().int(),
  amountPaid: z.number().int(),
  currency: z.string(),
  pageUrl: z.string().nullable(),
  pdfUrl: z.string().nullable(),
});
export type Invoice = z.infer<typeof invoiceSchema>;
export const invoicesReplySchema = z.object({ invoices: z.array(invoiceSchema) });
