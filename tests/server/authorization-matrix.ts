import { otherStrongPassword, strongPassword } from '../helpers/accounts'
import type { Actor } from '../helpers/team-fixture'
import { resourceMatrixRows } from './authorization-matrix-resources'

/**
 * Who may call what: every route of the API × every kind of caller → the expected status.
 * Source: docs/api.md (routes, roles admin ⊃ editor ⊃ viewer, 401/403/404).
 *
 * Paths are the Express templates exactly as the app declares them; `:teamId` is the fixture's
 * team (the one "other-team-admin" is not in: 404 for them), `:userId` a viewer of that team.
 * Body strings of the form ':name' are filled from the fixture too (see team-fixture.ts).
 * A new route must get a row here: authorization.test.ts fails until it has one.
 */
export interface MatrixRow {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  path: string
  body?: Record<string, unknown>
  expect: Record<Actor, number>
}

const everyone = (status: number): Record<Actor, number> => ({
  anonymous: status,
  viewer: status,
  editor: status,
  admin: status,
  'other-team-admin': status,
})
const signedIn = (status: number): Record<Actor, number> => ({
  ...everyone(status),
  anonymous: 401,
})
/** A route of the fixture's team: members by role, outsiders 404, signed-out 401. */
const team = (viewer: number, editor: number, admin: number): Record<Actor, number> => ({
  anonymous: 401,
  viewer,
  editor,
  admin,
  'other-team-admin': 404,
})

export const authorizationMatrix: MatrixRow[] = [
  { method: 'GET', path: '/api/health', expect: everyone(200) },
  { method: 'GET', path: '/api/v1/library/packs', expect: everyone(200) },
  { method: 'GET', path: '/api/v1/library/amplifiers', expect: everyone(200) },
  { method: 'GET', path: '/api/v1/library/speakers', expect: everyone(200) },
  { method: 'GET', path: '/api/v1/library/accessories', expect: everyone(200) },
  { method: 'GET', path: '/api/v1/library/converters', expect: everyone(200) },
  // Public; an empty body is refused as invalid input for everyone alike, never 401/403.
  { method: 'POST', path: '/api/v1/estimate', body: {}, expect: everyone(400) },
  { method: 'POST', path: '/api/v1/compare', body: {}, expect: everyone(400) },

  {
    method: 'POST',
    path: '/api/v1/auth/sign-up',
    body: { email: 'new-person@crew.example', name: 'New Person', password: strongPassword },
    expect: everyone(202),
  },
  {
    method: 'POST',
    path: '/api/v1/auth/sign-in',
    body: { email: 'viewer@crew.example', password: strongPassword },
    expect: everyone(200),
  },
  { method: 'POST', path: '/api/v1/auth/sign-out', expect: everyone(204) },
  { method: 'POST', path: '/api/v1/auth/sign-out-everywhere', expect: signedIn(204) },
  { method: 'GET', path: '/api/v1/auth/me', expect: signedIn(200) },
  { method: 'GET', path: '/api/v1/auth/session', expect: everyone(200) },
  { method: 'PATCH', path: '/api/v1/auth/me', body: { name: 'Renamed' }, expect: signedIn(200) },
  {
    method: 'POST',
    path: '/api/v1/auth/password',
    body: { currentPassword: strongPassword, newPassword: otherStrongPassword },
    expect: signedIn(200),
  },
  {
    method: 'POST',
    path: '/api/v1/auth/password-reset',
    body: { email: 'target@crew.example' },
    expect: everyone(202),
  },
  {
    method: 'POST',
    path: '/api/v1/auth/password-reset/confirm',
    body: { token: ':resetToken', password: otherStrongPassword },
    expect: everyone(204),
  },
  // Every fixture actor's address is confirmed already; the link works signed in or out.
  { method: 'POST', path: '/api/v1/auth/email-verification', expect: signedIn(409) },
  {
    method: 'POST',
    path: '/api/v1/auth/email-verification/confirm',
    body: { token: ':verificationToken' },
    expect: everyone(204),
  },

  { method: 'GET', path: '/api/v1/teams', expect: signedIn(200) },
  { method: 'POST', path: '/api/v1/teams', body: { name: 'Side project' }, expect: signedIn(201) },
  { method: 'GET', path: '/api/v1/teams/:teamId', expect: team(200, 200, 200) },
  {
    method: 'PATCH',
    path: '/api/v1/teams/:teamId',
    body: { name: 'Renamed crew' },
    expect: team(403, 403, 200),
  },
  { method: 'GET', path: '/api/v1/teams/:teamId/members', expect: team(200, 200, 200) },
  {
    method: 'PATCH',
    path: '/api/v1/teams/:teamId/members/:userId',
    body: { role: 'editor' },
    expect: team(403, 403, 200),
  },
  { method: 'DELETE', path: '/api/v1/teams/:teamId/members/:userId', expect: team(403, 403, 204) },
  { method: 'GET', path: '/api/v1/teams/:teamId/invitations', expect: team(403, 403, 200) },
  {
    method: 'POST',
    path: '/api/v1/teams/:teamId/invitations',
    body: { email: 'fresh@elsewhere.example', role: 'viewer' },
    expect: team(403, 403, 201),
  },
  {
    method: 'DELETE',
    path: '/api/v1/teams/:teamId/invitations/:invitationId',
    expect: team(403, 403, 204),
  },

  {
    method: 'POST',
    path: '/api/v1/invitations/preview',
    body: { token: ':invitationToken' },
    expect: everyone(200),
  },
  // The invitation is for an address none of the actors has.
  {
    method: 'POST',
    path: '/api/v1/invitations/accept',
    body: { token: ':invitationToken' },
    expect: signedIn(403),
  },

  // Anyone signed in: each sees their teams' mail (as admin) and mail to their own address.
  { method: 'GET', path: '/api/v1/dev/outbox', expect: signedIn(200) },
  // The parts library and saved rigs.
  ...resourceMatrixRows(team),
  // A pack's discharge logs. A JSON body carries no file: editors get 400 for it.
  {
    method: 'POST',
    path: '/api/v1/teams/:teamId/packs/:packId/discharge-logs',
    expect: team(403, 400, 400),
  },
  {
    method: 'GET',
    path: '/api/v1/teams/:teamId/packs/:packId/discharge-logs',
    expect: team(200, 200, 200),
  },
  {
    method: 'GET',
    path: '/api/v1/teams/:teamId/packs/:packId/discharge-logs/:logId',
    expect: team(200, 200, 200),
  },
  {
    method: 'DELETE',
    path: '/api/v1/teams/:teamId/packs/:packId/discharge-logs/:logId',
    expect: team(403, 204, 204),
  },
  // Viewers see what accepting would change; only editors accept.
  {
    method: 'GET',
    path: '/api/v1/teams/:teamId/packs/:packId/discharge-logs/:logId/accept-preview',
    expect: team(200, 200, 200),
  },
  {
    method: 'POST',
    path: '/api/v1/teams/:teamId/packs/:packId/discharge-logs/:logId/accept',
    expect: team(403, 200, 200),
  },
  // The runtime card: viewers read it, editors share and e-mail it; a live link opens
  // the card for anyone, signed in or not.
  { method: 'GET', path: '/api/v1/teams/:teamId/plans/:planId/card', expect: team(200, 200, 200) },
  {
    method: 'GET',
    path: '/api/v1/teams/:teamId/plans/:planId/share-links',
    expect: team(200, 200, 200),
  },
  {
    method: 'POST',
    path: '/api/v1/teams/:teamId/plans/:planId/share-links',
    body: {},
    expect: team(403, 201, 201),
  },
  {
    method: 'DELETE',
    path: '/api/v1/teams/:teamId/plans/:planId/share-links/:linkId',
    expect: team(403, 204, 204),
  },
  {
    method: 'POST',
    path: '/api/v1/teams/:teamId/plans/:planId/card-emails',
    body: { to: ['volunteer@crew.example'] },
    expect: team(403, 201, 201),
  },
  { method: 'GET', path: '/api/v1/shared/:token', expect: everyone(200) },
  // An event's card and its share links, as a plan's.
  {
    method: 'GET',
    path: '/api/v1/teams/:teamId/events/:eventId/share-links',
    expect: team(200, 200, 200),
  },
  {
    method: 'POST',
    path: '/api/v1/teams/:teamId/events/:eventId/share-links',
    body: {},
    expect: team(403, 201, 201),
  },
  {
    method: 'DELETE',
    path: '/api/v1/teams/:teamId/events/:eventId/share-links/:eventLinkId',
    expect: team(403, 204, 204),
  },
  { method: 'GET', path: '/api/v1/shared/events/:eventToken', expect: everyone(200) },
]
