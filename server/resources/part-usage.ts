import { and, eq, inArray, sql } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import type { WriteActor } from './resource-definition'
import { rigAccessories, rigs } from '../db/schema-resources'

export interface RigRef {
  id: number
  name: string
}

/** Which rigs point at a part, and how to let go of it. */
export interface PartUsage {
  rigsUsing(tx: Queryable, teamId: number, partId: number): RigRef[]
  /** Removes the references (the rigs keep their copied values); bumps each rig's version. */
  detach(tx: Queryable, partId: number, rigIds: number[], actor: WriteActor): void
}

/** A rig column holding the part's id (pack, amplifier, speaker set). */
export function rigColumnUsage(key: 'packId' | 'amplifierId' | 'speakersId'): PartUsage {
  const column = rigs[key]
  return {
    rigsUsing: (tx, teamId, partId) =>
      tx
        .select({ id: rigs.id, name: rigs.name })
        .from(rigs)
        .where(and(eq(rigs.teamId, teamId), eq(column, partId)))
        .orderBy(rigs.name, rigs.id)
        .all(),
    detach: (tx, partId, rigIds, actor) => {
      if (rigIds.length === 0) return
      tx.update(rigs)
        .set({
          [key]: null,
          version: sql`${rigs.version} + 1`,
          updatedAtMs: actor.nowMs,
          updatedByUserId: actor.userId,
        })
        .where(and(eq(column, partId), inArray(rigs.id, rigIds)))
        .run()
    },
  }
}

/** The rig_accessories link table (accessories). */
export const accessoryLinkUsage: PartUsage = {
  rigsUsing: (tx, teamId, partId) =>
    tx
      .select({ id: rigs.id, name: rigs.name })
      .from(rigAccessories)
      .innerJoin(rigs, eq(rigs.id, rigAccessories.rigId))
      .where(and(eq(rigs.teamId, teamId), eq(rigAccessories.accessoryId, partId)))
      .orderBy(rigs.name, rigs.id)
      .all(),
  detach: (tx, partId, rigIds, actor) => {
    if (rigIds.length === 0) return
    tx.delete(rigAccessories).where(eq(rigAccessories.accessoryId, partId)).run()
    tx.update(rigs)
      .set({
        version: sql`${rigs.version} + 1`,
        updatedAtMs: actor.nowMs,
        updatedByUserId: actor.userId,
      })
      .where(inArray(rigs.id, rigIds))
      .run()
  },
}
