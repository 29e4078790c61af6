import { and, eq } from 'drizzle-orm'
import { insertOwnedItem } from '../resources/resource-definition'
import { planDefinition } from '../resources/plans'
import { eventDefinition } from '../resources/events'
import { packKindKey } from '../../shared/events/pack-kinds'
import { eventBodySchema } from '../../shared/schemas/events'
import { planBodySchema } from '../../shared/schemas/plans'
import type { Queryable } from './queryable'
import { plans, rigs } from './schema-resources'
import type { DemoSeedStep } from './seed'

// The demo crew's whole Saturday (invented demo data, README "Demo sign-ins"): the market-stage plan of
// seed-plans.ts, a busker cart on its 12 V lead-acid battery and the wireless-mic announcer box,
// sharing the crew's box of packs and the market office's sockets. Invented data.

function rigOf(tx: Queryable, teamId: number, name: string) {
  const rig = tx
    .select({ id: rigs.id, spec: rigs.spec })
    .from(rigs)
    .where(and(eq(rigs.teamId, teamId), eq(rigs.name, name)))
    .get()
  if (!rig) throw new Error(`The demo event needs the demo rig "${name}", seeded before it`)
  return rig
}

function planIdOf(tx: Queryable, teamId: number, name: string): number {
  const plan = tx
    .select({ id: plans.id })
    .from(plans)
    .where(and(eq(plans.teamId, teamId), eq(plans.name, name)))
    .get()
  if (!plan) throw new Error(`The demo event needs the demo plan "${name}", seeded before it`)
  return plan.id
}

export const seedDemoEvents: DemoSeedStep = (tx, demo) => {
  const scope = {
    tx,
    teamId: demo.teamIds.alder,
    userId: demo.userIds.alderEditor,
    nowMs: demo.nowMs,
  }
  const market = rigOf(tx, scope.teamId, 'Market stage columns')
  const cart = rigOf(tx, scope.teamId, 'Busker cart')
  const announcer = rigOf(tx, scope.teamId, 'Announcer box')
  const day = { date: '2026-06-13', temperatureC: 12 }
  // Levels are peaks below clipping; crest factors are the programme presets of docs/model.md §5.
  const cartPlanId = insertOwnedItem(
    scope,
    planDefinition,
    planBodySchema.parse({
      ...day,
      name: 'Saturday busker cart',
      notes: 'Two sets by the bakery stall.',
      rigId: cart.id,
      startTime: '09:00',
      packCount: 1,
      schedule: [
        {
          label: 'First set',
          minutes: 90,
          state: 'on',
          peakBelowClipDb: 3,
          crestFactorDb: 15,
          playingPct: 85,
        },
        { label: 'Break', minutes: 60, state: 'off' },
        {
          label: 'Second set',
          minutes: 90,
          state: 'on',
          peakBelowClipDb: 3,
          crestFactorDb: 15,
          playingPct: 85,
        },
      ],
    }),
  )
  const announcerPlanId = insertOwnedItem(
    scope,
    planDefinition,
    planBodySchema.parse({
      ...day,
      name: 'Saturday announcer box',
      notes: 'At the info tent: raffle, lost children, stall news.',
      rigId: announcer.id,
      startTime: '08:00',
      packCount: 2,
      schedule: [
        {
          label: 'Opening and stall news',
          minutes: 180,
          state: 'on',
          peakBelowClipDb: 6,
          crestFactorDb: 13,
          playingPct: 25,
        },
        {
          label: 'Raffle and close',
          minutes: 180,
          state: 'on',
          peakBelowClipDb: 4,
          crestFactorDb: 13,
          playingPct: 40,
        },
      ],
    }),
  )
  const toolPack = packKindKey(market.spec.pack)
  const cartBattery = packKindKey(cart.spec.pack)
  const announcerBattery = packKindKey(announcer.spec.pack)
  insertOwnedItem(
    scope,
    eventDefinition,
    eventBodySchema.parse({
      name: 'Alder Creek Farmers’ Market, Saturday',
      notes: 'Chargers sit in the market office behind the info tent. Bring every pack charged.',
      date: day.date,
      planIds: [planIdOf(tx, scope.teamId, 'Saturday market'), cartPlanId, announcerPlanId],
      pool: [
        { kind: toolPack, count: 2 },
        { kind: cartBattery, count: 1 },
        { kind: announcerBattery, count: 2 },
      ],
      chargers: [
        { label: 'Tool-pack charger, office socket', powerW: 110, slots: 1, packKinds: [toolPack] },
        {
          label: 'LiFePO4 charger, office socket',
          powerW: 40,
          slots: 1,
          packKinds: [announcerBattery],
        },
      ],
    }),
  )
}
