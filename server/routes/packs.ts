import type { Router } from 'express'
import { packDefinition } from '../resources/packs'
import type { ResourceContext } from '../resources/resource-definition'
import { teamResourceRouter } from './team-resource-router'

export function packsRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, packDefinition)
}
