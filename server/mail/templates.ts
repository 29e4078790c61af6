import type { TeamRole } from '../../shared/schemas/teams'
import type { MailMessage } from './message'

export function escapeHtml(value: string): string {
  return value
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;')
}

interface Layout {
  to: string
  sentByTeamId: number | null
  subject: string
  paragraphs: string[]
  action: { label: string; url: string }
  footnote: string
}

// One look for every message: plain paragraphs, one button, the bare link for text-only readers.
function compose(layout: Layout): MailMessage {
  const text = [
    ...layout.paragraphs,
    `${layout.action.label}: ${layout.action.url}`,
    layout.footnote,
    '— Loudhour',
  ].join('\n\n')
  const html = `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; color: #1b2326; line-height: 1.5">
${layout.paragraphs.map((paragraph) => `<p>${escapeHtml(paragraph)}</p>`).join('\n')}
<p><a href="${escapeHtml(layout.action.url)}" style="display: inline-block; padding: 10px 16px; background: #1f5e70; color: #ffffff; border-radius: 6px; text-decoration: none">${escapeHtml(layout.action.label)}</a></p>
<p style="font-size: 13px">Or paste this link into a browser: ${escapeHtml(layout.action.url)}</p>
<p style="font-size: 13px; color: #56656b">${escapeHtml(layout.footnote)}</p>
</body></html>`
  return {
    to: layout.to,
    subject: layout.subject,
    text,
    html,
    sentByTeamId: layout.sentByTeamId,
  }
}

export function invitationMail(input: {
  to: string
  teamId: number
  teamName: string
  inviterName: string
  role: TeamRole
  url: string
}): MailMessage {
  return compose({
    to: input.to,
    sentByTeamId: input.teamId,
    // Fixed: the team's and the inviter's names are whatever the sender typed, so they stay in
    // the body (escaped), never in the line a mail program shows before anything else.
    subject: 'An invitation to a team on Loudhour',
    paragraphs: [
      `${input.inviterName} invited you to the team "${input.teamName}" on Loudhour as ${input.role}.`,
      `Sign in or create an account with this address (${input.to}), then accept the invitation.`,
    ],
    action: { label: 'Accept the invitation', url: input.url },
    footnote:
      'The link works once and expires in 7 days. If you did not expect it, ignore this message.',
  })
}

export function passwordResetMail(input: { to: string; url: string }): MailMessage {
  return compose({
    to: input.to,
    sentByTeamId: null,
    subject: 'Reset your Loudhour password',
    paragraphs: [
      'Someone asked to reset the password of the Loudhour account with this address.',
      'Choosing a new password signs the account out on every device.',
    ],
    action: { label: 'Choose a new password', url: input.url },
    footnote:
      'The link works once and expires in 30 minutes. If you did not ask for it, ignore this message: your password stays as it is.',
  })
}

export function emailVerificationMail(input: { to: string; url: string }): MailMessage {
  return compose({
    to: input.to,
    sentByTeamId: null,
    subject: 'Confirm your address for Loudhour',
    paragraphs: [
      'Someone made a Loudhour account with this address. If it was you, confirm the address: then the account can send invitations and runtime cards.',
    ],
    action: { label: 'Confirm the address', url: input.url },
    footnote: `The link works once and expires in ${emailVerificationLifetimeHours} hours. If you did not make the account, ignore this message: the account cannot send mail from this address.`,
  })
}

/** To an address that already has an account, when someone signs up with it again. */
export function accountExistsMail(input: { to: string; url: string }): MailMessage {
  return compose({
    to: input.to,
    sentByTeamId: null,
    subject: 'You already have a Loudhour account',
    paragraphs: [
      'Someone tried to make a new Loudhour account with this address, which has one already. Nothing was changed.',
      'If it was you and you have forgotten the password, ask for a reset link on the sign-in page.',
    ],
    action: { label: 'Reset the password', url: input.url },
    footnote: 'If it was not you, ignore this message: your account and password stay as they are.',
  })
}

// Kept beside the footnote that states it; email-verifications.ts applies it.
export const emailVerificationLifetimeHours = 48

/** Links in messages point at the client's pages, under PUBLIC_URL. */
export function linkTo(
  publicUrl: string,
  path: '/invitations/accept' | '/reset-password' | '/verify-email',
  token: string,
): string {
  // Concatenated, not resolved, so a PUBLIC_URL with a path prefix keeps it; base64url needs no escaping.
  return `${publicUrl}${path}?token=${token}`
}

/** A client page under PUBLIC_URL that takes no token. */
export function pageAt(publicUrl: string, path: '/forgot-password'): string {
  return `${publicUrl}${path}`
}
