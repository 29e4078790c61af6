// Sound level and hearing. Free-field estimates: measure with a meter on the day.

export const DEFAULT_LISTENER_DISTANCE_M = 3 // ours: the front of a small outdoor audience
export const DEFAULT_BOUNDARY_GAIN_DB = 0 // docs/model.md §8: free field unless the user says otherwise
export const NIOSH_REL_DBA = 85 // NIOSH 98-126: recommended exposure limit, 8-hour TWA
export const NIOSH_REL_MINUTES = 480
export const NIOSH_EXCHANGE_RATE_DB = 3 // NIOSH 98-126
export const WHO_VENUE_LAEQ_DB = 100 // WHO Global standard for safe listening venues (2022): LAeq,15 min
// from memory: guidance for events with children sits several dB below the adult figures
export const CHILDREN_CAUTION_DB = 80

/**
 * Sound pressure level at distance d from drivers at different places, which add in power across
 * the mid and high band an A-weighted level is made of (incoherent sources: Kinsler et al.,
 * Fundamentals of Acoustics, on combining sound levels; Davis & Patronis, Sound System Engineering):
 * S + 10·log10(N·P_driver) − 20·log10(d/1 m) + boundary gain, over the N drivers facing the
 * listener, all channels together.
 */
export function soundLevelDb(
  sensitivityDb: number,
  driverPowerW: number,
  driversFacing: number,
  distanceM: number,
  boundaryGainDb: number,
): number {
  return (
    sensitivityDb +
    10 * Math.log10(driversFacing * driverPowerW) -
    distanceLossDb(distanceM) +
    boundaryGainDb
  )
}

/** Inverse-square spreading from 1 m: 20·log10(d / 1 m). */
export function distanceLossDb(distanceM: number): number {
  return 20 * Math.log10(distanceM)
}

// ours: a ceiling (about 19 years) that keeps the figure finite for near-silent programmes
export const MAX_PERMITTED_MINUTES = 1e7

/** NIOSH permitted time T = 8 h / 2^((L − 85)/3) (NIOSH 98-126). */
export function nioshPermittedMinutes(levelDb: number): number {
  const minutes = NIOSH_REL_MINUTES / 2 ** ((levelDb - NIOSH_REL_DBA) / NIOSH_EXCHANGE_RATE_DB)
  return Math.min(minutes, MAX_PERMITTED_MINUTES)
}

/** Equivalent level of a programme playing only part of the time: 10·log10 of the share. */
export function equivalentLevelDb(playingLevelDb: number, playingShare: number): number {
  return playingLevelDb + 10 * Math.log10(playingShare)
}
