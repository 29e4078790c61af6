import { speakers } from '../db/schema-resources'
import { partDefinition } from './part-resource'
import { rigColumnUsage } from './part-usage'
import { speakersBodySchema, speakersUpdateSchema } from '../../shared/schemas/resources'

/** The team's own speaker sets: `/api/v1/teams/:teamId/speakers` (served by server/routes/team-resource-router.ts). */
export const speakersDefinition = partDefinition({
  table: speakers,
  noun: 'speaker set',
  idParam: 'speakersId',
  createSchema: speakersBodySchema,
  updateSchema: speakersUpdateSchema,
  usage: rigColumnUsage('speakersId'),
})
