import {
  accessoryBody,
  amplifierBody,
  packBody,
  plainRigSpec,
  speakersBody,
} from '../helpers/resource-fixture'
import { planBody } from '../helpers/plan-fixture'
import { eventBody } from '../helpers/event-fixture'
import type { Actor } from '../helpers/team-fixture'
import type { MatrixRow } from './authorization-matrix'

// Rows of the authorization matrix for the team's parts and rigs. Source: docs/api.md
// ("Team-owned resources": viewers read, editors write, admin for deleting a part in use) and
// The fixture's parts are all used by its rig, so an editor's delete of one is a 403.

/** The matrix's own helper: members by role, outsiders 404, signed-out 401. */
type TeamExpect = (viewer: number, editor: number, admin: number) => Record<Actor, number>

function resourceRows(
  team: TeamExpect,
  collection: string,
  idParam: string,
  body: Record<string, unknown>,
  deleteExpect: Record<Actor, number>,
): MatrixRow[] {
  const list = `/api/v1/teams/:teamId/${collection}`
  const item = `${list}/:${idParam}`
  return [
    { method: 'GET', path: list, expect: team(200, 200, 200) },
    { method: 'POST', path: list, body, expect: team(403, 201, 201) },
    { method: 'GET', path: item, expect: team(200, 200, 200) },
    { method: 'PUT', path: item, body: { ...body, version: 1 }, expect: team(403, 200, 200) },
    { method: 'DELETE', path: item, expect: deleteExpect },
    { method: 'POST', path: `${item}/duplicate`, expect: team(403, 201, 201) },
  ]
}

export function resourceMatrixRows(team: TeamExpect): MatrixRow[] {
  const partInUse = team(403, 403, 200)
  const rigBody = { name: 'Announcer box', spec: plainRigSpec }
  return [
    ...resourceRows(team, 'packs', 'packId', packBody, partInUse),
    ...resourceRows(team, 'amplifiers', 'amplifierId', amplifierBody, partInUse),
    ...resourceRows(team, 'speakers', 'speakersId', speakersBody, partInUse),
    ...resourceRows(team, 'accessories', 'accessoryId', accessoryBody, partInUse),
    ...resourceRows(team, 'rigs', 'rigId', rigBody, team(403, 204, 204)),
    // Plans as rigs; the body names the fixture's plan rig, as a number.
    ...resourceRows(
      team,
      'plans',
      'planId',
      { ...planBody, rigId: '#planRigId' },
      team(403, 204, 204),
    ),
    // Events as plans: a day of the team's plans (`#eventPlanId` becomes the number).
    ...resourceRows(
      team,
      'events',
      'eventId',
      { ...eventBody, planIds: ['#eventPlanId'] },
      team(403, 204, 204),
    ),
    // The answer for an unsaved event: a read, so viewers may ask.
    {
      method: 'POST',
      path: '/api/v1/teams/:teamId/events/preview',
      body: { planIds: ['#eventPlanId'], pool: [], chargers: [] },
      expect: team(200, 200, 200),
    },
  ]
}
