import { z } from 'zod';
import {
  billingSummarySchema,
  checkoutReplySchema,
  invoicesReplySchema,
  plansReplySchema,
  seatChangePreviewSchema,
  subscriptionSchema,
  type CheckoutRequest,
} from '@shared/schemas/billing';
import { api } from './http';

const subscriptionReply = z.object({ subscription: subscriptionSchema });
const seatPreviewReply = z.object({ preview: seatChangePreviewSchema });

/** The organisation's seat plan; only admins reach these. */
export const billingApi = {
  summary: () => api.get('/api/billing', billingSummarySchema),
  plans: () => api.get('/api/billing/plans', plansReplySchema),
  invoices: () => api.get('/api/billing/invoices', invoicesReplySchema),
  checkout: (body: CheckoutRequest) => api.post('/api/billing/checkout', body, { schema: checkoutReplySchema, quiet: true }),
  previewSeats: (seats: number) => api.post('/api/billing/seats/preview', { seats }, { schema: seatPreviewReply, quiet: true }),
  resize: (seats: number) => api.put('/api/billing/seats', { seats }, { schema: subscriptionReply, quiet: true }),
  cancel: () => api.post('/api/billing/cancel', undefined, { schema: subscriptionReply }),
  resume: () => api.post('/api/billing/resume', undefined, { schema: subscriptionReply }),
};
