// `npm run bench`: medians for the engine's two budgets on this machine:
// one estimate of a 12-hour, three-pack schedule (≤ 1 ms) and one rig against 40 packs (≤ 40 ms).
import { afterAll, bench, describe } from 'vitest'
import { comparePacks } from '../../shared/engine/compare'
import { estimate } from '../../shared/engine/estimate'
import { MAX_STEP_S } from '../../shared/engine/run'
import { segmentEnergies } from '../../shared/plans/segment-energy'
import { packSchema } from '../../shared/schemas/estimate'
import { columnRig, variant } from '../shared/rig-fixtures'

const column = columnRig()
const twelveHourDay = variant(column, {
  pack: { ...column.pack, parallelCells: 1 },
  programme: { crestFactorDb: 12, peakBelowClipDb: 2 },
  schedule: [
    { label: 'Set-up', minutes: 60, state: 'idle' },
    { label: 'Morning games', minutes: 180, playingPct: 80 },
    { label: 'Lunch', minutes: 60, state: 'off' },
    { label: 'Afternoon', minutes: 300 },
    { label: 'Speeches', minutes: 60, crestFactorDb: 14, peakBelowClipDb: 6 },
    { label: 'Finale', minutes: 60, peakBelowClipDb: 0 },
  ],
})

// A festival week as a plan: seven days of the schedule above, each ended by a night off (42
// segments), on enough packs to last it.
const week = variant(twelveHourDay, {
  pack: { ...twelveHourDay.pack, count: 20 },
  schedule: Array.from({ length: 7 }, () => [
    ...twelveHourDay.schedule!,
    { label: 'Night', minutes: 720, state: 'off' as const },
  ]).flat(),
})

const fortyPacks = Array.from({ length: 40 }, (_, index) =>
  packSchema.parse({
    chemistry: index % 4 === 3 ? 'lifepo4' : 'li-ion',
    seriesCells: index % 4 === 3 ? 6 : 5,
    parallelCells: 1 + (index % 3),
    cellCapacityAh: 2 + (index % 5) * 0.5,
    count: 1 + (index % 2),
    massKg: 0.4 + index * 0.02,
    price: 40 + index,
    label: `Pack ${index + 1}`,
  }),
)

const steps = (12 * 3600) / MAX_STEP_S
const estimateMs: number[] = []
const compareMs: number[] = []
const weekSegmentsMs: number[] = []

function timed(samples: number[], work: () => unknown): void {
  const start = performance.now()
  work()
  samples.push(performance.now() - start)
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  const middle = Math.floor(sorted.length / 2)
  return sorted.length % 2 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2
}

afterAll(() => {
  console.log(
    [
      `Engine medians (samples include warm-up): estimate of a 12-hour three-pack day ${median(estimateMs).toFixed(3)} ms (target ≤ 1 ms, ${estimateMs.length} runs);`,
      `one rig against 40 packs ${median(compareMs).toFixed(1)} ms (target ≤ 40 ms, ${compareMs.length} runs);`,
      `energy per segment of a ${week.schedule!.length}-segment week ${median(weekSegmentsMs).toFixed(1)} ms (${weekSegmentsMs.length} runs).`,
    ].join('\n'),
  )
})

describe(`engine (12 h at ${MAX_STEP_S} s steps: up to ${steps} steps per run)`, () => {
  bench(
    'estimate: 12-hour, three-pack schedule',
    () => timed(estimateMs, () => estimate(twelveHourDay)),
    {
      time: 2000,
      warmupIterations: 50,
    },
  )

  bench(
    'comparePacks: one rig against 40 packs',
    () => timed(compareMs, () => comparePacks(twelveHourDay, fortyPacks)),
    {
      time: 3000,
      iterations: 30,
      warmupIterations: 5,
    },
  )

  bench(
    `segmentEnergies: a ${week.schedule!.length}-segment week`,
    () => timed(weekSegmentsMs, () => segmentEnergies(week)),
    { time: 2000, iterations: 20, warmupIterations: 3 },
  )
})
