import type { EstimateWarning } from '@shared/schemas/estimate'

/**
 * The warnings that make a rig unfit to use as it stands (severity `danger`), which a headline
 * says before any runtime. A schedule that does not last is left out: the plan's headline says
 * that itself, and it is no hazard.
 */
export function mustChange(warnings: readonly EstimateWarning[]): EstimateWarning[] {
  return warnings.filter(
    (warning) => warning.severity === 'danger' && warning.code !== 'schedule-short',
  )
}

/** "1 thing must change first" / "3 things must change first". */
export function mustChangeTitle(count: number): string {
  return `${count} ${count === 1 ? 'thing' : 'things'} must change before this rig is used`
}

export const RUNTIME_NOT_VALID = 'Not valid until the changes above are made.'
