import type { Router } from 'express'
import { amplifiers } from '../db/schema-resources'
import { partDefinition } from '../resources/part-resource'
import { teamResourceRouter } from '../resources/team-resource-router'
import { rigColumnUsage } from '../resources/part-usage'
import type { ResourceContext } from '../resources/resource-definition'
import { amplifierBodySchema, amplifierUpdateSchema } from '../../shared/schemas/resources'

/** The team's own amplifiers: `/api/v1/teams/:teamId/amplifiers` (see team-resource-router.ts). */
export const amplifierDefinition = partDefinition({
  table: amplifiers,
  noun: 'amplifier',
  idParam: 'amplifierId',
  createSchema: amplifierBodySchema,
  updateSchema: amplifierUpdateSchema,
  usage: rigColumnUsage('amplifierId'),
})

export function amplifiersRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, amplifierDefinition)
}
