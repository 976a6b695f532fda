import { AppError } from '../../errors';

/** One answer for a wrong, used, replaced or expired link, so none of them can be told apart. */
const INVALID_LINK = {
  invitation: 'This invitation link is not valid any more (used, expired or replaced). Ask your admin to send a new one.',
  reset: 'This reset link is not valid any more (used, expired or replaced). Ask for a new one.',
  'sign-up': 'This link is not valid any more (used or expired). Sign in, or create the account again.',
};

export const invalidLink = (what: keyof typeof INVALID_LINK) => new AppError(400, 'invalid_token', INVALID_LINK[what]);

export const tooManyMails = () =>
  new AppError(429, 'too_many_mails', 'Too many mails went to this address in the last hour; try again later.');
