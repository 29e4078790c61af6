import type { Router } from 'express'
import { accessories } from '../db/schema-resources'
import { partDefinition } from '../resources/part-resource'
import { teamResourceRouter } from '../resources/team-resource-router'
import { accessoryLinkUsage } from '../resources/part-usage'
import type { ResourceContext } from '../resources/resource-definition'
import { accessoryBodySchema, accessoryUpdateSchema } from '../../shared/schemas/resources'

/** The team's own accessories: `/api/v1/teams/:teamId/accessories` (see team-resource-router.ts). */
export const accessoryDefinition = partDefinition({
  table: accessories,
  noun: 'accessory',
  idParam: 'accessoryId',
  createSchema: accessoryBodySchema,
  updateSchema: accessoryUpdateSchema,
  usage: accessoryLinkUsage,
})

export function accessoriesRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, accessoryDefinition)
}
