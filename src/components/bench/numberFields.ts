import type { DisplayQuantity } from '@/display/units'

/** One numeric field of a form, declared as data so forms read like a table of their fields. */
export interface NumberFieldSpec<Key extends string = string> {
  key: Key
  label: string
  unit?: string
  quantity?: DisplayQuantity
  whole?: boolean
  step?: number
  hint?: string
}
