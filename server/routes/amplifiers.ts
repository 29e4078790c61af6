import type { Router } from 'express'
import { amplifierDefinition } from '../resources/amplifiers'
import type { ResourceContext } from '../resources/resource-definition'
import { teamResourceRouter } from './team-resource-router'

export function amplifiersRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, amplifierDefinition)
}
