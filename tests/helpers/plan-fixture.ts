import type { Queryable } from '../../server/db/queryable'
import { insertOwnedItem } from '../../server/resources/resource-definition'
import { planDefinition } from '../../server/resources/plans'
import { rigDefinition } from '../../server/resources/rigs'
import { planBodySchema } from '../../shared/schemas/plans'
import { rigBodySchema } from '../../shared/schemas/resources'
import { plainRigSpec } from './resource-fixture'

// An event plan for API tests, on a rig of its own so the parts fixture's rig stays unused by
// plans (its delete is a 204 in the matrix).

export const planBody = {
  name: 'School sports day',
  date: '2026-06-13',
  startTime: '08:00',
  temperatureC: 12,
  packCount: 2,
  swapPolicy: { mode: 'when-empty' },
  schedule: [
    { label: 'Warm-up music', minutes: 60, state: 'on', peakBelowClipDb: 6, crestFactorDb: 12 },
    { label: 'Lunch', minutes: 45, state: 'off' },
    { label: 'Relay races', minutes: 90, state: 'on', peakBelowClipDb: 3, crestFactorDb: 12 },
  ],
} as const

export interface PlanIds {
  planId: string
  planRigId: string
}

export function seedPlanFixture(
  db: Queryable,
  teamId: number,
  userId: number,
  nowMs: number,
): PlanIds {
  const scope = { tx: db, teamId, userId, nowMs }
  const rigId = insertOwnedItem(
    scope,
    rigDefinition,
    rigBodySchema.parse({ name: 'Sports day column', spec: plainRigSpec }),
  )
  const planId = insertOwnedItem(
    scope,
    planDefinition,
    planBodySchema.parse({ ...planBody, rigId }),
  )
  return { planId: String(planId), planRigId: String(rigId) }
}
