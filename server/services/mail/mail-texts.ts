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

/** A reset link; `requestedBy` names the admin who sent it, otherwise someone asked on the sign-in page. */
export function passwordResetMail(input: { link: string; validMinutes: number; requestedBy?: string }): { subject: string; text: string } {
  return {
    subject: 'Choose a new Tarnish password',
    text: [
      input.requestedBy
        ? `${input.requestedBy}, an admin of your team, sent you a link to choose a new password for your Tarnish account.`
        : 'Someone asked to reset the password of the Tarnish account for this address.',
      '',
      'Open this link to choose a new password:',
      input.link,
      '',
      `The link works once and for ${input.validMinutes} minutes. If you did not ask for it, ignore this mail; your password stays as it is.`,
    ].join('\n'),
  };
}

/** To a new address that asked for an account: the link that finishes it. */
export function signUpMail(input: { organisationName: string; link: string; validDays: number }): { subject: string; text: string } {
  return {
    subject: 'Finish creating your Tarnish account',
    text: [
      `Someone (we hope you) asked to create a Tarnish account for ${input.organisationName} with this address.`,
      '',
      'Open this link to confirm the address and sign in:',
      input.link,
      '',
      `The link works once and for ${input.validDays} days. If you did not ask for an account, ignore this mail and nothing happens.`,
    ].join('\n'),
  };
}

/** To an address that already has an account, when someone asks for another one with it: the answer goes to its owner only. */
export function accountExistsMail(input: { signInLink: string; resetLink: string }): { subject: string; text: string } {
  return {
    subject: 'Your address already has a Tarnish account',
    text: [
      'Someone asked to create a new Tarnish account with this address, which already has one, so no new account was made.',
      '',
      `If it was you, sign in: ${input.signInLink}`,
      `Forgot your password? Choose a new one: ${input.resetLink}`,
      '',
      'If it was not you, ignore this mail; your account is unchanged.',
    ].join('\n'),
  };
}

/** To an address of another organisation's account that an admin tried to invite: told here, not to the inviter. */
export function invitationRefusedMail(input: { organisationName: string }): { subject: string; text: string } {
  return {
    subject: 'An invitation to Tarnish could not be sent to this address',
    text: [
      `${input.organisationName} tried to invite this address to their Tarnish team. It already belongs to a Tarnish account,`,
      'and an address can belong to one organisation only, so no invitation was made.',
      '',
      'If you want to join them, give them another address of yours. Otherwise ignore this mail.',
    ].join('\n'),
  };
}

/** To a client a briefing was shared with: what it is and the link that opens it. */
export function briefingSharedMail(input: { sharerName: string; organisationName: string; title: string; link: string }): { subject: string; text: string } {
  return {
    subject: `${input.organisationName} shared a briefing with you: ${input.title}`,
    text: [
      `${input.sharerName} of ${input.organisationName} shared the briefing "${input.title}" with you on Tarnish.`,
      '',
      'Open it here (sign in with this address):',
      input.link,
      '',
      'You can read it, download it as PDF or CSV and send questions to the team from the page.',
    ].join('\n'),
  };
}

/** To each client a briefing is shared with, when a new version of it is published. */
export function briefingVersionMail(input: { publisherName: string; organisationName: string; title: string; version: number; link: string }): { subject: string; text: string } {
  return {
    subject: `New version of a briefing shared with you: ${input.title}`,
    text: [
      `${input.publisherName} of ${input.organisationName} published version ${input.version} of the briefing "${input.title}".`,
      '',
      'Open it here (sign in with this address):',
      input.link,
      '',
      'Earlier versions stay readable from the same page.',
    ].join('\n'),
  };
}
