import { labelOf, partKinds } from '@/components/parts/partKinds'
import type { PlanOfRig, RigKeepsHealthReason } from '@shared/discharge/health-effect'
import { formatNumber, withUnit } from '@/display/format'

// How the effect of applying a measured health figure reads on the pack page: one short line a
// rig or plan, the reason in plain words.

const packFields = partKinds.find((kind) => kind.id === 'packs')?.fields ?? []
const fieldLabel = (key: string) => {
  const field = packFields.find((candidate) => candidate.key === key)
  return (field ? labelOf(field) : key).toLowerCase()
}

/** "87.3 %", or "as labelled" for no figure. */
export function healthText(healthPct: number | null): string {
  return healthPct === null ? 'as labelled' : withUnit(formatNumber(healthPct, 1), '%')
}

/** Why a rig keeps its figure, as the end of "… because it …". */
export function keepsReasonText(reason: RigKeepsHealthReason): string {
  switch (reason.kind) {
    case 'other-pack':
      return `was saved with another pack${reason.packName ? `, "${reason.packName}"` : ''}`
    case 'no-saved-pack':
      return "was not saved with one of the team's packs"
    case 'copy-differs':
      return `has its own copy of the pack, which differs in ${reason.fields.map(fieldLabel).join(', ')}: the log was read against the pack as saved`
    case 'same-health':
      return 'already uses this figure'
  }
}

/** "Market Saturday (rig Market stage column)". */
export function planText(plan: PlanOfRig): string {
  return `${plan.name} (rig ${plan.rigName})`
}
