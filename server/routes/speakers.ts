import type { Router } from 'express'
import { speakers } from '../db/schema-resources'
import { partDefinition } from '../resources/part-resource'
import { teamResourceRouter } from '../resources/team-resource-router'
import { rigColumnUsage } from '../resources/part-usage'
import type { ResourceContext } from '../resources/resource-definition'
import { speakersBodySchema, speakersUpdateSchema } from '../../shared/schemas/resources'

/** The team's own speaker sets: `/api/v1/teams/:teamId/speakers` (see team-resource-router.ts). */
export const speakersDefinition = partDefinition({
  table: speakers,
  noun: 'speaker set',
  idParam: 'speakersId',
  createSchema: speakersBodySchema,
  updateSchema: speakersUpdateSchema,
  usage: rigColumnUsage('speakersId'),
})

export function speakersRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, speakersDefinition)
}
