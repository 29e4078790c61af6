// Synthetic discharge logs with answers known in closed form, written as CSV text.

export interface ConstantCurrentRun {
  currentA: number
  hours: number
  startV: number
  endV: number
  stepS: number
}

/** Samples of a constant current while the voltage falls linearly from startV to endV. */
export function constantCurrentSamples(run: ConstantCurrentRun) {
  const totalS = run.hours * 3600
  const samples: { timeS: number; voltageV: number; currentA: number }[] = []
  for (let timeS = 0; timeS <= totalS; timeS += run.stepS) {
    const fraction = timeS / totalS
    samples.push({
      timeS,
      voltageV: run.startV + (run.endV - run.startV) * fraction,
      currentA: run.currentA,
    })
  }
  return samples
}

type Sample = ReturnType<typeof constantCurrentSamples>[number]

/** CSV text with the given header and one row per sample, cells made by `cells`. */
export function csvOf(
  samples: readonly Sample[],
  header: string,
  cells: (sample: Sample) => (string | number)[],
  delimiter = ',',
): string {
  return [header, ...samples.map((sample) => cells(sample).join(delimiter))].join('\n') + '\n'
}

export const plainHeader = 'time_s,voltage_v,current_a'
export const plainCells = (sample: Sample) => [sample.timeS, sample.voltageV, sample.currentA]

/** Seconds as h:mm:ss, as many loggers write elapsed time. */
export function clockOf(totalS: number): string {
  const hours = Math.floor(totalS / 3600)
  const minutes = Math.floor((totalS % 3600) / 60)
  const seconds = totalS % 60
  return `${hours}:${String(minutes).padStart(2, '0')}:${String(seconds).padStart(2, '0')}`
}
