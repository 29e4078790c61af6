// Speaker leads (per channel, amplifier to speakers): their round-trip resistance sits in series
// with the load, so the amplifier drives speakers and cable together and the cable's share of
// the output heats it.
import type { LeadInputs } from './leads'
import { leadResistanceOhm } from './leads'

export interface SpeakerLeadsModel {
  /** Round trip, out and back, per channel. */
  resistanceOhm: number
  /** Share of the amplifier's output that reaches the speakers, Z/(Z + R). */
  speakerShare: number
  /** Share that heats the cable, in %: 100·R/(Z + R). */
  lossPct: number
}

/**
 * One current through cable and speakers in series divides the power as the resistances:
 * P_speakers / P_out = Z/(Z + R) (Ohm's law, P = I²R). Z is the nominal load; a real speaker's
 * impedance swings with frequency, so this is the share at its nominal figure.
 */
export function speakerShare(speakerLoadOhm: number, leadOhm: number): number {
  return speakerLoadOhm / (speakerLoadOhm + leadOhm)
}

/** The speaker leads' figures at a temperature; a rig without them loses nothing. */
export function speakerLeadsModel(
  leads: LeadInputs | null,
  speakerLoadOhm: number,
  temperatureC: number,
): SpeakerLeadsModel {
  if (!leads) return { resistanceOhm: 0, speakerShare: 1, lossPct: 0 }
  const resistanceOhm = leadResistanceOhm(leads, temperatureC)
  const share = speakerShare(speakerLoadOhm, resistanceOhm)
  return { resistanceOhm, speakerShare: share, lossPct: 100 * (1 - share) }
}
