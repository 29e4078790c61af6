import type { TeamRole } from './teams'

// Shapes of the accounts API's answers, so the client reads what the server writes.

export interface UserView {
  id: number
  email: string
  name: string
}

/** A team as seen by one member: `role` is that member's role. */
export interface TeamView {
  id: number
  name: string
  role: TeamRole
}

export interface MeResponse {
  user: UserView
  teams: TeamView[]
  /** True while the built-in mail catcher is in use (no SMTP_URL): its outbox may be read. */
  devOutbox: boolean
  /** False until the owner opens the mailed confirmation link; until then the account sends no mail. */
  emailVerified: boolean
}

/** The one answer to a sign-up, whether or not the address had an account. */
export interface SignUpAccepted {
  message: string
}

export interface MemberView {
  userId: number
  email: string
  name: string
  role: TeamRole
  joinedAt: string
}

export interface InvitationView {
  id: number
  email: string
  role: TeamRole
  createdAt: string
  expiresAt: string
}

/** What the holder of an invitation link may see before accepting it. */
export interface InvitationPreview {
  teamName: string
  email: string
  role: TeamRole
  expiresAt: string
}

export interface OutboxMessageView {
  id: string
  to: string
  subject: string
  text: string
  html: string
  date: string
}
