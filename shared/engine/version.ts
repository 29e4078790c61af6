/** Bump whenever a change alters any result, so saved summaries can be told apart. */
export const ENGINE_VERSION = '2.1.0'
