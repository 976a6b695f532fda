/** Amounts in the smallest currency unit (cents) as the payment service sends them. */
export function formatMoney(amount: number, currency: string): string {
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(amount / 100);
}

export function formatDate(iso: string | null): string {
  return iso ? new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium' }).format(new Date(iso)) : '—';
}

export function formatDateTime(iso: string | null): string {
  return iso ? new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(iso)) : '—';
}
