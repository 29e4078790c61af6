import { packs } from '../db/schema-resources'
import { ownedRowsOf } from './owned-table'
import { partDefinition, partSpecOf } from './part-resource'
import { rigColumnUsage } from './part-usage'
import { packBodySchema, packUpdateSchema } from '../../shared/schemas/resources'

/** The team's own packs: `/api/v1/teams/:teamId/packs` (served by server/routes/team-resource-router.ts). */
export const packDefinition = partDefinition({
  rows: ownedRowsOf(packs),
  noun: 'pack',
  idParam: 'packId',
  createSchema: packBodySchema,
  updateSchema: packUpdateSchema,
  values: (body, owned) => ({ ...owned, spec: partSpecOf(body) }),
  usage: rigColumnUsage('packId'),
})
