// The built-in generic parts library (no brand names), shared by the bench and the API.
export { libraryPacks } from './packs'
export { libraryAmplifiers } from './amplifiers'
export { librarySpeakers } from './speakers'
export { libraryAccessories } from './accessories'
export { libraryConverters, withConverter } from './converters'
export { exampleRigs } from './rigs'
export { libraryItem } from './find'
export type * from './types'
