import type { Router } from 'express'
import { rigDefinition } from '../resources/rigs'
import type { ResourceContext } from '../resources/resource-definition'
import { teamResourceRouter } from './team-resource-router'

export function rigsRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, rigDefinition)
}
