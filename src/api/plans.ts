import type { PlanBody, PlanItem } from '@shared/schemas/plans'
import { resourceApi } from './resources'

/** The team's event plans: `/api/v1/teams/:teamId/plans`, served like every team resource. */
export const plansApi = resourceApi<PlanItem, PlanBody>('plans')
