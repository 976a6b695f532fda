import { FakeStripeError } from '../errors';

/**
 * Test card numbers and what they do, following the service's published test cards
 * (docs.stripe.com/testing): 4242… succeeds, 4000…0002 is declined, 4000…9995 lacks funds.
 */
const TEST_CARDS: Record<string, { brand: string; decline?: { code: string; message: string } }> = {
  '4242424242424242': { brand: 'visa' },
  '4000000000000002': { brand: 'visa', decline: { code: 'generic_decline', message: 'Your card was declined.' } },
  '4000000000009995': {
    brand: 'visa',
    decline: { code: 'insufficient_funds', message: 'Your card has insufficient funds.' },
  },
};

export interface AcceptedCard {
  brand: string;
  last4: string;
}

/** Luhn checksum (ISO/IEC 7812-1), which every real card number passes. */
function passesLuhn(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i += 1) {
    let digit = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) digit = digit * 2 > 9 ? digit * 2 - 9 : digit * 2;
    sum += digit;
  }
  return sum % 10 === 0;
}

export function cardError(code: string, message: string, declineCode?: string): FakeStripeError {
  return new FakeStripeError(402, {
    type: 'card_error',
    code,
    message,
    ...(declineCode ? { decline_code: declineCode } : {}),
  });
}

/** Charges a newly entered card; a declined or unknown card throws a 402 card_error. */
export function chargeEnteredCard(cardNumber: string): AcceptedCard {
  const digits = cardNumber.replace(/[\s-]/g, '');
  if (!/^\d{12,19}$/.test(digits) || !passesLuhn(digits)) {
    throw cardError('incorrect_number', 'Your card number is incorrect.');
  }
  const card = TEST_CARDS[digits];
  if (!card) {
    throw cardError(
      'card_declined',
      'Your card was declined. Your request was in test mode, but used a non test card.',
      'test_mode_live_card',
    );
  }
  if (card.decline) throw cardError('card_declined', card.decline.message, card.decline.code);
  return { brand: card.brand, last4: digits.slice(-4) };
}
