import type { SegmentState, TimelinePoint } from '../schemas/estimate'
import { SEGMENT_STATES } from '../schemas/estimate'

export const MAX_TIMELINE_POINTS = 500
const STATES: readonly SegmentState[] = SEGMENT_STATES

/**
 * Keeps at most 500 chart points without allocating inside the step loop: the run offers a
 * sample every `stride` steps; when the buffer fills, every other unforced point is dropped and
 * the stride doubles. Forced points (start, swaps, segment edges, the end) survive compaction
 * while there is room.
 */
export class TimelineRecorder {
  stride: number
  private count = 0
  private readonly minute = new Float64Array(MAX_TIMELINE_POINTS)
  private readonly soc = new Float64Array(MAX_TIMELINE_POINTS)
  private readonly voltage = new Float64Array(MAX_TIMELINE_POINTS)
  private readonly draw = new Float64Array(MAX_TIMELINE_POINTS)
  private readonly headroom = new Float64Array(MAX_TIMELINE_POINTS)
  private readonly clip = new Float64Array(MAX_TIMELINE_POINTS)
  private readonly pack = new Int32Array(MAX_TIMELINE_POINTS)
  private readonly state = new Uint8Array(MAX_TIMELINE_POINTS)
  private readonly forced = new Uint8Array(MAX_TIMELINE_POINTS)

  /** `expectedSamples`: steps the run will offer, when known, so no compaction is needed. */
  constructor(expectedSamples: number | null) {
    // Leave a fifth of the buffer for forced points.
    this.stride =
      expectedSamples === null
        ? 1
        : Math.max(1, Math.ceil(expectedSamples / (0.8 * MAX_TIMELINE_POINTS)))
  }

  push(
    minute: number,
    socPct: number,
    voltageV: number,
    drawW: number,
    headroomDb: number,
    clipPowerW: number,
    pack: number,
    state: SegmentState,
    forced: boolean,
  ): void {
    const previous = this.count - 1
    // A second point at the same moment, pack and state replaces the first (a closing point).
    const same =
      previous >= 0 &&
      this.minute[previous] === minute &&
      this.pack[previous] === pack &&
      this.state[previous] === STATES.indexOf(state)
    if (!same && this.count === MAX_TIMELINE_POINTS) this.compact()
    const i = same ? previous : this.count++
    this.minute[i] = minute
    this.soc[i] = socPct
    this.voltage[i] = voltageV
    this.draw[i] = drawW
    this.headroom[i] = headroomDb
    this.clip[i] = clipPowerW
    this.pack[i] = pack
    this.state[i] = STATES.indexOf(state)
    this.forced[i] = forced || (same && this.forced[i] === 1) ? 1 : 0
  }

  private compact(): void {
    const keepForced = this.keptCount(true) <= 0.75 * MAX_TIMELINE_POINTS
    let kept = 0
    for (let i = 0; i < this.count; i++) {
      const last = i === this.count - 1
      if (i % 2 === 0 || last || (keepForced && this.forced[i] === 1)) this.move(i, kept++)
    }
    this.count = kept
    this.stride *= 2
  }

  private keptCount(keepForced: boolean): number {
    let kept = 0
    for (let i = 0; i < this.count; i++) {
      if (i % 2 === 0 || (keepForced && this.forced[i] === 1)) kept++
    }
    return kept
  }

  private move(from: number, to: number): void {
    this.minute[to] = this.minute[from]!
    this.soc[to] = this.soc[from]!
    this.voltage[to] = this.voltage[from]!
    this.draw[to] = this.draw[from]!
    this.headroom[to] = this.headroom[from]!
    this.clip[to] = this.clip[from]!
    this.pack[to] = this.pack[from]!
    this.state[to] = this.state[from]!
    this.forced[to] = this.forced[from]!
  }

  points(): TimelinePoint[] {
    const points: TimelinePoint[] = []
    for (let i = 0; i < this.count; i++) {
      points.push({
        minute: this.minute[i]!,
        socPct: this.soc[i]!,
        voltageV: this.voltage[i]!,
        drawW: this.draw[i]!,
        headroomDb: this.headroom[i]!,
        pack: this.pack[i]!,
        clipPowerW: this.clip[i]!,
        state: STATES[this.state[i]!] ?? 'on',
      })
    }
    return points
  }
}
