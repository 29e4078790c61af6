import { and, eq, inArray } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { packs, plans, rigs } from '../db/schema-resources'
import { recomputePlansOfRig } from './plans'
import type { WriteActor } from './resource-definition'
import { summariseRig } from './summaries'
import type {
  PackHealthEffect,
  PlanOfRig,
  RigHealthChange,
  RigHealthKept,
  RigKeepsHealthReason,
} from '../../shared/discharge/health-effect'
import type { PackSpec } from '../../shared/schemas/estimate'

type RigRow = typeof rigs.$inferSelect

// Fields outside the pack's electrical model: a health figure measured against the pack holds for
// a copy that differs only in these. The packs on hand belong to the rig, the name, mass and price
// do not enter a discharge, and the health figure is what is being replaced.
const fieldsNotCompared: readonly string[] = ['count', 'label', 'massKg', 'price', 'healthPct']

/** The pack fields in which a rig's copy differs from the pack as saved, in a stable order. */
function differingFields(copy: PackSpec, saved: PackSpec): string[] {
  const keys = new Set([...Object.keys(copy), ...Object.keys(saved)])
  return [...keys]
    .filter((key) => !fieldsNotCompared.includes(key))
    .filter(
      (key) =>
        JSON.stringify(copy[key as keyof PackSpec]) !==
        JSON.stringify(saved[key as keyof PackSpec]),
    )
    .sort()
}

function keepsBecause(
  rig: RigRow,
  pack: { id: number; spec: PackSpec },
  healthPct: number,
  packNames: Map<number, string>,
): RigKeepsHealthReason | null {
  if (rig.packId === null) return { kind: 'no-saved-pack' }
  if (rig.packId !== pack.id) {
    return { kind: 'other-pack', packId: rig.packId, packName: packNames.get(rig.packId) ?? '' }
  }
  const fields = differingFields(rig.spec.pack, pack.spec)
  if (fields.length > 0) return { kind: 'copy-differs', fields }
  if (rig.spec.pack.healthPct === healthPct) return { kind: 'same-health' }
  return null
}

/**
 * What making `healthPct` the pack's health figure does to the team's rigs and plans. A rig takes
 * it when it was saved with this pack and its copy of the pack is the pack as saved now in every
 * field a discharge depends on: the log was read against that pack. Every other rig, and the plans
 * on it, keep their figures, each with the reason.
 */
export function packHealthEffect(
  tx: Queryable,
  teamId: number,
  pack: { id: number; spec: PackSpec },
  healthPct: number,
): PackHealthEffect {
  const teamRigs = tx
    .select()
    .from(rigs)
    .where(eq(rigs.teamId, teamId))
    .orderBy(rigs.name, rigs.id)
    .all()
  const otherPackIds = [...new Set(teamRigs.map((rig) => rig.packId))].filter(
    (id): id is number => id !== null && id !== pack.id,
  )
  const packNames = new Map(
    otherPackIds.length === 0
      ? []
      : tx
          .select({ id: packs.id, name: packs.name })
          .from(packs)
          .where(and(eq(packs.teamId, teamId), inArray(packs.id, otherPackIds)))
          .all()
          .map((row) => [row.id, row.name] as const),
  )
  const changing: RigHealthChange[] = []
  const keeping: RigHealthKept[] = []
  for (const rig of teamRigs) {
    const reason = keepsBecause(rig, pack, healthPct, packNames)
    if (reason) keeping.push({ id: rig.id, name: rig.name, reason })
    else
      changing.push({ id: rig.id, name: rig.name, fromHealthPct: rig.spec.pack.healthPct ?? null })
  }
  const changingRigIds = new Set(changing.map((rig) => rig.id))
  const teamPlans: PlanOfRig[] = tx
    .select({ id: plans.id, name: plans.name, rigId: plans.rigId, rigName: rigs.name })
    .from(plans)
    .innerJoin(rigs, eq(rigs.id, plans.rigId))
    .where(eq(plans.teamId, teamId))
    .orderBy(plans.name, plans.id)
    .all()
  return {
    healthPct,
    fromHealthPct: pack.spec.healthPct ?? null,
    rigs: { changing, keeping },
    plans: {
      changing: teamPlans.filter((plan) => changingRigIds.has(plan.rigId)),
      keeping: teamPlans.filter((plan) => !changingRigIds.has(plan.rigId)),
    },
  }
}

/**
 * Applies an effect's rig changes: each changing rig's copy of the pack takes the health figure
 * (a new rig version), and the rig's and its plans' summaries are worked out again.
 */
export function carryPackHealthToRigs(
  tx: Queryable,
  effect: PackHealthEffect,
  actor: WriteActor,
): void {
  for (const { id } of effect.rigs.changing) {
    const rig = tx.select().from(rigs).where(eq(rigs.id, id)).get()
    if (!rig) continue
    const spec = { ...rig.spec, pack: { ...rig.spec.pack, healthPct: effect.healthPct } }
    const summary = summariseRig(spec)
    tx.update(rigs)
      .set({
        spec,
        summary,
        summaryEngineVersion: summary.engineVersion,
        version: rig.version + 1,
        updatedAtMs: actor.nowMs,
        updatedByUserId: actor.userId,
      })
      .where(eq(rigs.id, rig.id))
      .run()
    recomputePlansOfRig(tx, rig.id, spec)
  }
}
