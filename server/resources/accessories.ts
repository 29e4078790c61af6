import { accessories } from '../db/schema-resources'
import { ownedRowsOf } from './owned-table'
import { partDefinition, partSpecOf } from './part-resource'
import { accessoryLinkUsage } from './part-usage'
import { accessoryBodySchema, accessoryUpdateSchema } from '../../shared/schemas/resources'

/** The team's own accessories: `/api/v1/teams/:teamId/accessories` (served by server/routes/team-resource-router.ts). */
export const accessoryDefinition = partDefinition({
  rows: ownedRowsOf(accessories),
  noun: 'accessory',
  idParam: 'accessoryId',
  createSchema: accessoryBodySchema,
  updateSchema: accessoryUpdateSchema,
  values: (body, owned) => ({ ...owned, spec: partSpecOf(body) }),
  usage: accessoryLinkUsage,
})
