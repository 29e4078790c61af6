import { and, asc, eq } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import {
  accessories,
  amplifiers,
  packs,
  plans,
  rigAccessories,
  rigs,
  speakers,
} from '../db/schema-resources'
import { ApiError, type FieldIssue } from '../http/errors'
import { ownedRowsOf } from './owned-table'
import { summariseRig } from './summaries'
import { recomputePlansOfRig } from './plans'
import type { ResourceDefinition, WriteScope } from './resource-definition'
import {
  RIG_SPEC_SCHEMA_VERSION,
  rigBodySchema,
  rigUpdateSchema,
  type RigBody,
  type RigItem,
} from '../../shared/schemas/resources'

function accessoryIdsOf(tx: Queryable, rigId: number): number[] {
  return tx
    .select({ id: rigAccessories.accessoryId })
    .from(rigAccessories)
    .where(eq(rigAccessories.rigId, rigId))
    .orderBy(asc(rigAccessories.position))
    .all()
    .map((link) => link.id)
}

const partTables = { packId: packs, amplifierId: amplifiers, speakersId: speakers } as const
const partNouns = { packId: 'pack', amplifierId: 'amplifier', speakersId: 'speaker set' } as const

/** Every referenced part must be one of this team's: a 400 naming each field that is not. */
function checkPartReferences({ tx, teamId }: WriteScope, body: RigBody): void {
  const issues: FieldIssue[] = []
  const owns = (
    table: typeof packs | typeof amplifiers | typeof speakers | typeof accessories,
    id: number,
  ) =>
    tx
      .select({ id: table.id })
      .from(table)
      .where(and(eq(table.id, id), eq(table.teamId, teamId)))
      .get() !== undefined
  for (const key of ['packId', 'amplifierId', 'speakersId'] as const) {
    const id = body[key]
    if (id != null && !owns(partTables[key], id)) {
      issues.push({ path: key, message: `No ${partNouns[key]} with id ${id} in this team` })
    }
  }
  body.accessoryIds?.forEach((id, index) => {
    if (!owns(accessories, id)) {
      issues.push({
        path: `accessoryIds.${index}`,
        message: `No accessory with id ${id} in this team`,
      })
    }
  })
  const first = issues[0]
  if (first) {
    throw new ApiError(
      400,
      'invalid-input',
      `The request body is not valid. ${first.path}: ${first.message}`,
      issues,
    )
  }
}

/** Saved rigs: `/api/v1/teams/:teamId/rigs`. The server runs the engine at every save. */
export const rigDefinition: ResourceDefinition<typeof rigs, RigBody, RigItem> = {
  rows: ownedRowsOf(rigs),
  noun: 'rig',
  idParam: 'rigId',
  createSchema: rigBodySchema,
  updateSchema: rigUpdateSchema,
  values: (body, owned) => {
    const summary = summariseRig(body.spec)
    return {
      ...owned,
      spec: body.spec,
      specSchemaVersion: RIG_SPEC_SCHEMA_VERSION,
      summary,
      summaryEngineVersion: summary.engineVersion,
      // A PUT replaces the rig: a reference left out is no reference.
      packId: body.packId ?? null,
      amplifierId: body.amplifierId ?? null,
      speakersId: body.speakersId ?? null,
    }
  },
  checkBody: checkPartReferences,
  afterWrite: ({ tx }, rigId, body) => {
    tx.delete(rigAccessories).where(eq(rigAccessories.rigId, rigId)).run()
    const links = (body.accessoryIds ?? []).map((accessoryId, position) => ({
      rigId,
      accessoryId,
      position,
    }))
    if (links.length > 0) tx.insert(rigAccessories).values(links).run()
    recomputePlansOfRig(tx, rigId, body.spec)
  },
  bodyOf: (tx, row) => ({
    name: row.name,
    notes: row.notes,
    spec: row.spec,
    packId: row.packId,
    amplifierId: row.amplifierId,
    speakersId: row.speakersId,
    accessoryIds: accessoryIdsOf(tx, row.id),
  }),
  toItem: (tx, row, meta) => ({
    ...meta,
    spec: row.spec,
    specSchemaVersion: row.specSchemaVersion,
    summary: row.summary ?? null,
    packId: row.packId,
    amplifierId: row.amplifierId,
    speakersId: row.speakersId,
    accessoryIds: accessoryIdsOf(tx, row.id),
  }),
  beforeDelete: ({ tx, teamId }, row) => {
    const usedBy = tx
      .select({ name: plans.name })
      .from(plans)
      .where(and(eq(plans.teamId, teamId), eq(plans.rigId, row.id)))
      .orderBy(plans.name)
      .all()
    if (usedBy.length > 0) {
      throw new ApiError(
        409,
        'rig-in-use',
        `This rig is used by ${usedBy.length === 1 ? 'the plan' : `${usedBy.length} plans:`} ${usedBy.map((plan) => `"${plan.name}"`).join(', ')}. Delete those plans or give them another rig first.`,
      )
    }
    return undefined
  },
}
