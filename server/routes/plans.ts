import type { Router } from 'express'
import { planDefinition } from '../resources/plans'
import type { ResourceContext } from '../resources/resource-definition'
import { teamResourceRouter } from './team-resource-router'

export function plansRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, planDefinition)
}
