import { AppError } from '../../errors';

/** One answer for a wrong, used, replaced or expired link, so none of them can be told apart. */
export const invalidLink = (what: 'invitation' | 'reset') =>
  new AppError(
    400,
    'invalid_token',
    what === 'invitation'
      ? 'This invitation link is not valid any more (used, expired or replaced). Ask your admin to send a new one.'
      : 'This reset link is not valid any more (used, expired or replaced). Ask for a new one.',
  );

export const tooManyMails = () =>
  new AppError(429, 'too_many_mails', 'Too many mails went to this address in the last hour; try again later.');
