// Supply current and voltage on bass peaks. A sustained bass note (a sine burst at the programme's
// peak level) lasts far longer than a board's capacitors can bridge, so the pack and lead carry
// its instantaneous current, not only its mean; the peaks are weighed over the whole run.
import type { AmplifierModel } from './amplifier'
import { amplifierConstantCurrentA, amplifierConstantPowerW } from './amplifier'
import { CANNOT_DELIVER, mixedLoadCurrentA, packOpenCircuitV } from './pack'
import { SINE_BURST_MEAN_TO_RMS } from './programme'
import type { RigLoads, RunSegment } from './run'
import { emptyOperatingPoint, solveOperatingPoint } from './run'

// common practice: the bass notes that carry a programme's peaks sit at 40–60 Hz; the lowest is
// the hardest on the supply (its ripple is the slowest for the capacitors to bridge)
export const BASS_NOTE_HZ = 40
// By definition: the supply power of a sine output, P(t) = 2·P̄·sin²(ωt) = P̄·(1 − cos 2ωt),
// swings at twice the note's frequency and peaks at twice its mean.
const CLASS_D_PEAK_TO_MEAN = 2
// By definition: a sine's peak over its rms. Class AB/B draws |i_load(t)| from its supply, whose
// peak is √2·rms = π/2 × its mean |i| (2√2/π × rms).
const SINE_PEAK_TO_RMS = Math.SQRT2

export interface PeakDemand {
  currentA: number
  /** At the pack terminals and at the amplifier after the lead. */
  terminalV: number
  supplyV: number
  /** False when the pack cannot deliver the burst at all. */
  delivered: boolean
}

/**
 * How much of the supply current's ripple still reaches the pack with bulk capacitance C at the
 * amplifier: the capacitor in parallel with the source resistance R is a first-order low-pass,
 * |Z| = R/√(1 + (ωRC)²) (any circuit theory text), at the ripple's 2 × the note's frequency.
 * Harmonics above it (class AB's |sin|) are smoothed more, so taking all at 2f errs safe.
 */
export function rippleShare(sourceOhm: number, capacitanceF: number): number {
  const omegaRc = 2 * Math.PI * 2 * BASS_NOTE_HZ * sourceOhm * capacitanceF
  return 1 / Math.sqrt(1 + omegaRc * omegaRc)
}

function burstSegment(burstPerChannelW: number): RunSegment {
  return {
    label: 'peak',
    state: 'on',
    durationS: 0,
    playingShare: 1,
    outputPerChannelW: burstPerChannelW,
    peakPerChannelW: burstPerChannelW,
    averageToClipAtClipping: 1, // a sine
    meanToRms: SINE_BURST_MEAN_TO_RMS,
    headroomPeakW: burstPerChannelW,
    chargeW: 0,
  }
}

/** Supply current at the crest of the burst's ripple, by class, for the output it plays. */
function crestLoad(amplifier: AmplifierModel, outputPerChannelW: number) {
  const averageOutputW = amplifier.channels * outputPerChannelW
  switch (amplifier.ampClass) {
    case 'd':
      return {
        currentA: amplifier.idleCurrentA,
        powerW: CLASS_D_PEAK_TO_MEAN * amplifierConstantPowerW(amplifier, averageOutputW),
      }
    case 'ab':
      // mean|i| with k = peak/rms is the peak of |i|. Single-ended on one supply, the supply
      // carries the whole peak on the half-cycles it sources (the model halves the mean for that).
      return {
        currentA: amplifierConstantCurrentA(
          amplifier,
          outputPerChannelW,
          1,
          amplifier.bridged ? SINE_PEAK_TO_RMS : 2 * SINE_PEAK_TO_RMS,
        ),
        powerW: 0,
      }
    case 'a':
      // Class A draws its bias whatever it plays.
      return { currentA: amplifier.biasCurrentA, powerW: 0 }
  }
}

/**
 * The instantaneous peak of the supply current on a sustained bass note at a state of charge,
 * through pack and lead resistance. Every channel plays the note in phase (bass is mono), the
 * output is capped at what the sagging supply swings, and bulk capacitance, when given, smooths
 * the ripple above the mean.
 */
export function peakDemand(
  rig: RigLoads,
  burstPerChannelW: number,
  socFraction: number,
): PeakDemand {
  const openV = packOpenCircuitV(rig.pack, socFraction)
  const packOhm = rig.pack.resistanceOhm
  const totalOhm = packOhm + rig.leadOhm
  const burst = burstSegment(burstPerChannelW)
  const point = emptyOperatingPoint()
  let supplyGuessV = openV
  for (let pass = 0; pass < 3; pass++) {
    if (!solveOperatingPoint(rig, burst, openV, packOhm, supplyGuessV, point)) {
      return maximumPowerPoint(openV, packOhm, totalOhm)
    }
    supplyGuessV = point.supplyV
  }
  const meanCurrentA = point.currentA
  const outputPerChannelW = Math.min(
    burstPerChannelW,
    rig.amplifier.clipPowerPerV2 * supplyGuessV * supplyGuessV,
  )
  const crest = crestLoad(rig.amplifier, outputPerChannelW)
  const crestCurrentA = mixedLoadCurrentA(
    openV,
    totalOhm,
    crest.currentA + rig.linearCurrentTotalA,
    crest.powerW + rig.switchingPackW,
  )
  const share = rippleShare(totalOhm, rig.amplifier.bulkCapacitanceF)
  if (crestCurrentA === CANNOT_DELIVER && share === 1) {
    return maximumPowerPoint(openV, packOhm, totalOhm)
  }
  // Past the source's maximum-power point the crest is bounded by it: the most it can give.
  const unsmoothedA = crestCurrentA === CANNOT_DELIVER ? openV / (2 * totalOhm) : crestCurrentA
  const currentA = meanCurrentA + Math.max(unsmoothedA - meanCurrentA, 0) * share
  const terminalV = openV - currentA * packOhm
  const supplyV = openV - currentA * totalOhm
  return { currentA, terminalV, supplyV, delivered: supplyV > 0 }
}

/** Beyond the maximum-power point: the most the source gives is at half its voltage. */
function maximumPowerPoint(openV: number, packOhm: number, totalOhm: number): PeakDemand {
  const currentA = openV / (2 * totalOhm)
  return {
    currentA,
    terminalV: openV - currentA * packOhm,
    supplyV: openV - currentA * totalOhm,
    delivered: false,
  }
}

export interface PeakEnvelope {
  peakCurrentA: number
  minPeakTerminalV: number
  minPeakSupplyV: number
  /** False when at some charge the pack cannot deliver the burst at all. */
  delivered: boolean
}

// ours: eleven charges from the lowest reached to full find the worst moment to well within the
// OCV tables' own 1 % steps of curvature
const ENVELOPE_SAMPLES = 11

/**
 * Peaks over the whole run: from a full pack (peaks unclipped, the most output) down to the
 * lowest charge reached (the most current per watt), the largest current and the lowest voltages.
 */
export function peakEnvelope(
  rig: RigLoads,
  burstPerChannelW: number,
  lowestSocFraction: number,
): PeakEnvelope {
  const envelope: PeakEnvelope = {
    peakCurrentA: 0,
    minPeakTerminalV: Number.MAX_VALUE,
    minPeakSupplyV: Number.MAX_VALUE,
    delivered: true,
  }
  for (let i = 0; i < ENVELOPE_SAMPLES; i++) {
    const soc = lowestSocFraction + ((1 - lowestSocFraction) * i) / (ENVELOPE_SAMPLES - 1)
    const peak = peakDemand(rig, burstPerChannelW, soc)
    envelope.peakCurrentA = Math.max(envelope.peakCurrentA, peak.currentA)
    envelope.minPeakTerminalV = Math.min(envelope.minPeakTerminalV, peak.terminalV)
    envelope.minPeakSupplyV = Math.min(envelope.minPeakSupplyV, peak.supplyV)
    envelope.delivered &&= peak.delivered
  }
  return envelope
}
