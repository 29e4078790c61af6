import type { Router } from 'express'
import { accessoryDefinition } from '../resources/accessories'
import type { ResourceContext } from '../resources/resource-definition'
import { teamResourceRouter } from './team-resource-router'

export function accessoriesRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, accessoryDefinition)
}
