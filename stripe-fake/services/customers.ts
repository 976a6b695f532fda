import type { FakeContext } from '../context';
import { newId, newInvoicePrefix } from '../ids';
import { applyMetadataChanges } from '../metadata';
import type { Customer, Metadata } from '../types';

export interface CustomerFields {
  email?: string;
  name?: string;
  description?: string;
  phone?: string;
  metadata?: Metadata | null;
}

export function createCustomer(ctx: FakeContext, fields: CustomerFields): Customer {
  return ctx.state.customers.add({
    id: newId('cus'),
    object: 'customer',
    balance: 0,
    created: ctx.clock.now(),
    currency: null,
    description: fields.description ?? null,
    email: fields.email ?? null,
    invoice_prefix: newInvoicePrefix(),
    invoice_settings: { default_payment_method: null },
    livemode: false,
    metadata: { ...fields.metadata },
    name: fields.name ?? null,
    next_invoice_sequence: 1,
    phone: fields.phone ?? null,
  });
}

/** Changes the given fields; an empty text clears a field, as in the service. */
export function updateCustomer(customer: Customer, fields: CustomerFields): Customer {
  const { metadata, ...scalars } = fields;
  for (const [key, value] of Object.entries(scalars)) {
    (customer as unknown as Record<string, unknown>)[key] = value === '' ? null : value;
  }
  if (metadata !== undefined) applyMetadataChanges(customer.metadata, metadata);
  return customer;
}
