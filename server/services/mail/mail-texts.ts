import type { Role } from '../../../shared/schemas/auth';

/** The words of the mails Tarnish sends, in one place. */
export function invitationMail(input: {
  organisationName: string;
  inviterName: string;
  role: Role;
  link: string;
  validDays: number;
}): { subject: string; text: string } {
  return {
    subject: `You are invited to ${input.organisationName} on Tarnish`,
    text: [
      `${input.inviterName} invites you to join ${input.organisationName} on Tarnish as ${input.role}.`,
      '',
      'Open this link to choose your password and join:',
      input.link,
      '',
      `The link works once and for ${input.validDays} days. If you did not expect this mail, ignore it.`,
    ].join('\n'),
  };
}

export function passwordResetMail(input: { link: string; validMinutes: number }): { subject: string; text: string } {
  return {
    subject: 'Choose a new Tarnish password',
    text: [
      'Someone asked to reset the password of the Tarnish account for this address.',
      '',
      'Open this link to choose a new password:',
      input.link,
      '',
      `The link works once and for ${input.validMinutes} minutes. If you did not ask for it, ignore this mail; your password stays as it is.`,
    ].join('\n'),
  };
}
