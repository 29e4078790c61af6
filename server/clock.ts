/** The current time; tests pass a fake one to step past expiry without waiting. */
export type Clock = () => Date

export const systemClock: Clock = () => new Date()
