// A spy on the engine module for component and store tests: counts the estimate's runs and can
// make it fail (standing in for a bug in the engine). Use it as the factory of vi.mock:
//   vi.mock('../../shared/engine', async (original) =>
//     (await import('./engine-spy')).spiedEngine(original))
// and read `engineSpy` from a static import of this file (the same module instance).

type Engine = typeof import('../../shared/engine')

export const engineSpy = { runs: 0, fail: false }

export async function spiedEngine(importOriginal: () => Promise<unknown>): Promise<Engine> {
  const original = (await importOriginal()) as Engine
  return {
    ...original,
    estimate: (...args: Parameters<Engine['estimate']>) => {
      engineSpy.runs++
      if (engineSpy.fail) throw new Error('cutoff search did not converge')
      return original.estimate(...args)
    },
  }
}
