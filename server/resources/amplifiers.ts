import { amplifiers } from '../db/schema-resources'
import { ownedRowsOf } from './owned-table'
import { partDefinition, partSpecOf } from './part-resource'
import { rigColumnUsage } from './part-usage'
import { amplifierBodySchema, amplifierUpdateSchema } from '../../shared/schemas/resources'

/** The team's own amplifiers: `/api/v1/teams/:teamId/amplifiers` (served by server/routes/team-resource-router.ts). */
export const amplifierDefinition = partDefinition({
  rows: ownedRowsOf(amplifiers),
  noun: 'amplifier',
  idParam: 'amplifierId',
  createSchema: amplifierBodySchema,
  updateSchema: amplifierUpdateSchema,
  values: (body, owned) => ({ ...owned, spec: partSpecOf(body) }),
  usage: rigColumnUsage('amplifierId'),
})
