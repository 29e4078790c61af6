// How long a new share link works: the choices offered beside "create" and "e-mail".

export const EXPIRY_CHOICES = [
  { value: 'never', label: 'Until revoked' },
  { value: '1', label: '1 day' },
  { value: '7', label: '7 days' },
  { value: '30', label: '30 days' },
] as const
export type ExpiryChoice = (typeof EXPIRY_CHOICES)[number]['value']

const dayMs = 24 * 60 * 60 * 1000

/** The expiry to send for a choice, as ISO 8601 (UTC), or null for a link until revoked. */
export function expiresAtFor(choice: ExpiryChoice, nowMs: number): string | null {
  return choice === 'never' ? null : new Date(nowMs + Number(choice) * dayMs).toISOString()
}
