import { inject, provide, type InjectionKey } from 'vue'

/**
 * What a page tells the number fields below it, each named by its path in the page's request
 * (`pack.seriesCells`, `schedule.2.minutes`): the page's message for it, the value the engine
 * assumed while it is empty, and who hears text in it that is not a number.
 */
export interface NumberFieldContext {
  /** The page's message for the field (the shared schema's), if any. */
  messageAt?: (path: string) => string | undefined
  /** The value the engine assumed for the field while it is empty, in the engine's unit. */
  assumedAt?: (path: string) => number | undefined
  /**
   * Hears a field's unreadable text, by the field's path (or an id of its own without one), and
   * null once it is fixed or the field is gone: the page marks its results until then.
   */
  report?: (fieldId: string, message: string | null) => void
}

type ContextMaker = () => NumberFieldContext

const contextKey: InjectionKey<ContextMaker> = Symbol('number field context')

/**
 * Gives the number fields below the caller their page's context. `make` runs in each field's own
 * setup, so it may call composables there (on the bench, the estimate as that field's panel shows
 * it, which lags while the panel is off screen).
 */
export function provideNumberFieldContext(make: ContextMaker): void {
  provide(contextKey, make)
}

/** The page's context for one number field; call it in the field's setup. */
export function useNumberFieldContext(): NumberFieldContext {
  return inject(contextKey, null)?.() ?? {}
}
