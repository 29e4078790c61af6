import { packs } from '../db/schema-resources'
import { partDefinition } from './part-resource'
import { rigColumnUsage } from './part-usage'
import { packBodySchema, packUpdateSchema } from '../../shared/schemas/resources'

/** The team's own packs: `/api/v1/teams/:teamId/packs` (served by server/routes/team-resource-router.ts). */
export const packDefinition = partDefinition({
  table: packs,
  noun: 'pack',
  idParam: 'packId',
  createSchema: packBodySchema,
  updateSchema: packUpdateSchema,
  usage: rigColumnUsage('packId'),
})
