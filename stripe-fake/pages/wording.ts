/** Everything the hosted pages say, in one place. */
export const WORDING = {
  testMode: 'Test payments — no real money moves',
  checkoutTitle: 'Pay for your seat plan',
  email: 'E-mail for receipts',
  cardNumber: 'Card number',
  expiry: 'Expiry (MM / YY)',
  cvc: 'Security code',
  cardName: 'Name on card',
  pay: (amount: string) => `Pay ${amount} and start the plan`,
  cancel: 'Go back without paying',
  testCards:
    'Test cards: 4242 4242 4242 4242 is accepted; 4000 0000 0000 0002 is declined; 4000 0000 0000 9995 has insufficient funds. Any future expiry and any 3 digits.',
  declined: (reason: string) =>
    `${reason} Nothing was charged and no plan was started. Check the card or try another one.`,
  badExpiry: 'Enter the card expiry as MM / YY, in the future.',
  badCvc: 'Enter the 3 or 4 digit security code from the back of the card.',
  sessionClosed: 'This payment page is no longer open.',
  invoiceTitle: (number: string) => `Invoice ${number}`,
  invoicePaid: 'Paid',
  invoiceOpen: 'Payment due',
  downloadPdf: 'Download PDF',
  total: 'Total',
  amountDue: 'Amount due',
  amountPaid: 'Amount paid',
  creditUsed: 'Credit applied',
};
