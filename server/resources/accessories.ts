import { accessories } from '../db/schema-resources'
import { partDefinition } from './part-resource'
import { accessoryLinkUsage } from './part-usage'
import { accessoryBodySchema, accessoryUpdateSchema } from '../../shared/schemas/resources'

/** The team's own accessories: `/api/v1/teams/:teamId/accessories` (served by server/routes/team-resource-router.ts). */
export const accessoryDefinition = partDefinition({
  table: accessories,
  noun: 'accessory',
  idParam: 'accessoryId',
  createSchema: accessoryBodySchema,
  updateSchema: accessoryUpdateSchema,
  usage: accessoryLinkUsage,
})
