import type { Router } from 'express'
import { speakersDefinition } from '../resources/speakers'
import type { ResourceContext } from '../resources/resource-definition'
import { teamResourceRouter } from './team-resource-router'

export function speakersRouter(context: ResourceContext): Router {
  return teamResourceRouter(context, speakersDefinition)
}
