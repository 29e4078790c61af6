import { speakers } from '../db/schema-resources'
import { ownedRowsOf } from './owned-table'
import { partDefinition, partSpecOf } from './part-resource'
import { rigColumnUsage } from './part-usage'
import { speakersBodySchema, speakersUpdateSchema } from '../../shared/schemas/resources'

/** The team's own speaker sets: `/api/v1/teams/:teamId/speakers` (served by server/routes/team-resource-router.ts). */
export const speakersDefinition = partDefinition({
  rows: ownedRowsOf(speakers),
  noun: 'speaker set',
  idParam: 'speakersId',
  createSchema: speakersBodySchema,
  updateSchema: speakersUpdateSchema,
  values: (body, owned) => ({ ...owned, spec: partSpecOf(body) }),
  usage: rigColumnUsage('speakersId'),
})
