export interface SpeakerWiring {
  driverOhm: number
  parallel: number
  banks: number
}

/** Banks in series, each of `parallel` equal drivers: Z = banks × Z_driver / parallel (docs/model.md §3). */
export function loadOhm(wiring: SpeakerWiring): number {
  return (wiring.banks * wiring.driverOhm) / wiring.parallel
}

export function driversPerChannel(wiring: SpeakerWiring): number {
  return wiring.banks * wiring.parallel
}

/** Equal drivers share the channel's power equally. */
export function powerPerDriverW(channelPowerW: number, wiring: SpeakerWiring): number {
  return channelPowerW / driversPerChannel(wiring)
}

// from memory: a loudspeaker's impedance dips to about 0.8 × its nominal figure above resonance
export const IMPEDANCE_DIP_FACTOR = 0.8
