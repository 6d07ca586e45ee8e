/**
 * The text of every message Scholium sends. Plain text only; names and titles
 * are the ones stored in the database, links are absolute (`baseUrl` has no trailing slash).
 * No message ever names a referee.
 */
import type { VerdictCounts } from '../../shared/types/editorial'
import type { MailMessage } from './transport'

/** The invitation to join a manuscript as a coauthor. */
export function coauthorInvitationMail(input: { to: string, inviterName: string, manuscriptTitle: string, link: string, expiresAt: Date }): MailMessage {
  return {
    to: input.to,
    subject: `Invitation to coauthor "${input.manuscriptTitle}" on Scholium`,
    text: [
      `${input.inviterName} invites you to join the manuscript "${input.manuscriptTitle}" on Scholium as a coauthor.`,
      '',
      'Open this link, sign in (or create an account) with this e-mail address, and accept:',
      input.link,
      '',
      `The link works once and expires on ${input.expiresAt.toUTCString()}.`,
      'If you did not expect this invitation, ignore this message.',
    ].join('\n'),
  }
}

/** The link that sets a new password. */
export function passwordResetMail(input: { to: string, link: string, validMinutes: number }): MailMessage {
  return {
    to: input.to,
    subject: 'Set a new Scholium password',
    text: [
      'Someone (we hope you) asked to set a new password for the Scholium account with this e-mail address.',
      '',
      'Choose a new password here:',
      input.link,
      '',
      `The link works once and for ${input.validMinutes} minutes. If you did not ask for it, ignore this message: your password stays as it is.`,
    ].join('\n'),
  }
}

/** Counts per verdict, as `verdictCountsOf` (shared/types/report-schema.ts) reads them. */
export type RunSummaryCounts = VerdictCounts

/** The notice that a long check run has finished, with its counts. */
export function checkFinishedMail(input: { to: string, manuscriptTitle: string, revisionNumber: number, counts: RunSummaryCounts, link: string, seconds: number }): MailMessage {
  const c = input.counts
  return {
    to: input.to,
    subject: `Check finished: "${input.manuscriptTitle}", revision ${input.revisionNumber}`,
    text: [
      `The check of revision ${input.revisionNumber} of "${input.manuscriptTitle}" has finished after ${input.seconds} s.`,
      '',
      `Claims found: ${c.claims}`,
      `  verified:    ${c.verified}`,
      `  mismatch:    ${c.mismatch}`,
      `  unsupported: ${c.unsupported}`,
      `  error:       ${c.error}`,
      '',
      'The report, line by line:',
      input.link,
    ].join('\n'),
  }
}

/** Sent instead of a second account when someone signs up with an address that already has one. */
export function accountExistsMail(input: { to: string, signInLink: string, resetLink: string }): MailMessage {
  return {
    to: input.to,
    subject: 'Your Scholium account already exists',
    text: [
      'Someone (perhaps you) tried to create a Scholium account with this e-mail address, which already has one.',
      'No second account was made and your password is unchanged.',
      '',
      `Sign in here: ${input.signInLink}`,
      `Forgot the password? Set a new one here: ${input.resetLink}`,
      '',
      'If it was not you, ignore this message.',
    ].join('\n'),
  }
}
