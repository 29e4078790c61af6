import { amplifiers } from '../db/schema-resources'
import { partDefinition } from './part-resource'
import { rigColumnUsage } from './part-usage'
import { amplifierBodySchema, amplifierUpdateSchema } from '../../shared/schemas/resources'

/** The team's own amplifiers: `/api/v1/teams/:teamId/amplifiers` (served by server/routes/team-resource-router.ts). */
export const amplifierDefinition = partDefinition({
  table: amplifiers,
  noun: 'amplifier',
  idParam: 'amplifierId',
  createSchema: amplifierBodySchema,
  updateSchema: amplifierUpdateSchema,
  usage: rigColumnUsage('amplifierId'),
})
