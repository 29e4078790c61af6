// What accepting a log's health figure does beyond the pack itself: which rigs and plans take it,
// and which keep what they have and why (docs/api.md, "The team's parts, rigs and plans"). The
// server works it out; the pack page shows it before and after the figure is applied.

/** Why a rig keeps the health figure it has. */
export type RigKeepsHealthReason =
  /** The rig was saved with another of the team's packs. */
  | { kind: 'other-pack'; packId: number; packName: string }
  /** The rig's pack is not one of the team's saved packs (typed in, or from the library). */
  | { kind: 'no-saved-pack' }
  /**
   * The rig was saved with this pack, but its copy of the pack differs from the pack as saved
   * now in these fields (the pack was edited since, or the copy was): the log was read against
   * the pack as saved, so its health figure is not the copy's.
   */
  | { kind: 'copy-differs'; fields: string[] }
  /** The rig's copy of the pack already has this health figure. */
  | { kind: 'same-health' }

export interface RigHealthChange {
  id: number
  name: string
  /** The health figure of the rig's copy of the pack now; null when none is set (as labelled). */
  fromHealthPct: number | null
}

export interface RigHealthKept {
  id: number
  name: string
  reason: RigKeepsHealthReason
}

/** A plan runs on its rig: it changes exactly when its rig does. */
export interface PlanOfRig {
  id: number
  name: string
  rigId: number
  rigName: string
}

export interface PackHealthEffect {
  /** The figure applied: the log's health, to one decimal as the pack form takes it. */
  healthPct: number
  /** The pack's own figure before; null when none is set (as labelled, 100 %). */
  fromHealthPct: number | null
  rigs: { changing: RigHealthChange[]; keeping: RigHealthKept[] }
  /** Changing plans are worked out again with the new figure; keeping plans run as before. */
  plans: { changing: PlanOfRig[]; keeping: PlanOfRig[] }
}
