import type { Router } from 'express'
import { packs } from '../db/schema-resources'
import { partDefinition } from '../resources/part-resource'
import { teamResourceRouter } from '../resources/team-resource-router'
import { rigColumnUsage } from '../resources/part-usage'
import type { ResourceContext } from '../resources/resource-definition'
import { packBodySchema, packUpdateSchema } from '../../shared/schemas/resources'

/** The team's own packs: `/api/v1/teams/:teamId/packs` (see team-resource-router.ts). */
export const packDefinition = partDefinition({
  table: packs,
  noun: 'pack',
  idParam: 'packId',
  createSchema: packBodySchema,
  updateSchema: packUpdateSchema,
  usage: rigColumnUsage('packId'),
})

export function packsRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, packDefinition)
}
