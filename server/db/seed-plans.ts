import { and, eq } from 'drizzle-orm'
import { insertOwnedItem } from '../resources/resource-definition'
import { planDefinition } from '../resources/plans'
import { planBodySchema } from '../../shared/schemas/plans'
import type { Queryable } from './queryable'
import { rigs } from './schema-resources'
import type { DemoSeedStep } from './seed'

// The demo crew's Saturday (invented demo data, README "Demo sign-ins"): the market-stage rig from
// 08:00 to 14:00 at 12 °C. Invented data.

/** The name seed-resources.ts gives the demo crew's market-stage rig. */
const MARKET_RIG_NAME = 'Market stage columns'

function marketRigId(tx: Queryable, teamId: number): number {
  const rig = tx
    .select({ id: rigs.id })
    .from(rigs)
    .where(and(eq(rigs.teamId, teamId), eq(rigs.name, MARKET_RIG_NAME)))
    .get()
  if (!rig)
    throw new Error(`The demo plan needs the demo rig "${MARKET_RIG_NAME}", seeded before it`)
  return rig.id
}

export const seedDemoPlans: DemoSeedStep = (tx, demo) => {
  const scope = {
    tx,
    teamId: demo.teamIds.alder,
    userId: demo.userIds.alderEditor,
    nowMs: demo.nowMs,
  }
  const rigId = marketRigId(tx, scope.teamId)
  // Levels are peaks below clipping; crest factors are the programme presets of docs/model.md §5.
  const body = planBodySchema.parse({
    name: 'Saturday market',
    notes: 'Stage by the north gate. Charge both packs on Friday evening.',
    rigId,
    date: '2026-06-13',
    startTime: '08:00',
    temperatureC: 12,
    packCount: 2,
    swapPolicy: { mode: 'at-break-below', belowSocPct: 30 },
    schedule: [
      { label: 'Setup and sound check', minutes: 30, state: 'idle' },
      {
        label: 'Morning music',
        minutes: 150,
        state: 'on',
        peakBelowClipDb: 2,
        crestFactorDb: 9,
        playingPct: 90,
      },
      {
        label: 'Stall announcements',
        minutes: 30,
        state: 'on',
        peakBelowClipDb: 4,
        crestFactorDb: 13,
        playingPct: 40,
      },
      { label: 'Lunch (rig off)', minutes: 30, state: 'off' },
      {
        label: 'Afternoon music',
        minutes: 90,
        state: 'on',
        peakBelowClipDb: 2,
        crestFactorDb: 9,
        playingPct: 90,
      },
      {
        label: 'Prize draw and close',
        minutes: 30,
        state: 'on',
        peakBelowClipDb: 1,
        crestFactorDb: 13,
        playingPct: 70,
      },
    ],
  })
  insertOwnedItem(scope, planDefinition, body)
}
