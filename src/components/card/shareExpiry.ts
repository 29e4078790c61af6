// How long a new share link works: the choices offered beside "create" and "e-mail".

export const EXPIRY_CHOICES = [
  // The server's default for a plan: through the day after its date, wherever the crew is.
  { value: 'after-event', label: 'Until the day after the event' },
  { value: 'never', label: 'Until revoked' },
  { value: '1', label: '1 day' },
  { value: '7', label: '7 days' },
  { value: '30', label: '30 days' },
] as const
export type ExpiryChoice = (typeof EXPIRY_CHOICES)[number]['value']

const dayMs = 24 * 60 * 60 * 1000

/**
 * The expiry to send for a choice: ISO 8601 (UTC), null for a link until revoked, or nothing
 * for the server's default (until the day after the plan's date).
 */
export function expiresAtFor(choice: ExpiryChoice, nowMs: number): string | null | undefined {
  if (choice === 'after-event') return undefined
  return choice === 'never' ? null : new Date(nowMs + Number(choice) * dayMs).toISOString()
}
