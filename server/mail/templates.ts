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
  shownToAdminsOf: number[]
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
    shownToAdminsOf: layout.shownToAdminsOf,
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
    shownToAdminsOf: [input.teamId],
    subject: `Join ${input.teamName} on Loudhour`,
    paragraphs: [
      `${input.inviterName} invited you to the team "${input.teamName}" on Loudhour as ${input.role}.`,
      `Sign in or create an account with this address (${input.to}), then accept the invitation.`,
    ],
    action: { label: 'Accept the invitation', url: input.url },
    footnote:
      'The link works once and expires in 7 days. If you did not expect it, ignore this message.',
  })
}

export function passwordResetMail(input: {
  to: string
  teamIds: number[]
  url: string
}): MailMessage {
  return compose({
    to: input.to,
    shownToAdminsOf: input.teamIds,
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

/** Links in messages point at the client pages of api.md, under PUBLIC_URL. */
export function linkTo(
  publicUrl: string,
  path: '/invitations/accept' | '/reset-password',
  token: string,
): string {
  // Concatenated, not resolved, so a PUBLIC_URL with a path prefix keeps it; base64url needs no escaping.
  return `${publicUrl}${path}?token=${token}`
}
