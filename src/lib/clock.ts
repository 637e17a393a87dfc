/**
 * The time, in one place: services take `now` as an argument and routes pass `clock()`, so tests
 * can run batching and expiry at any moment they choose.
 */
export const clock = (): Date => new Date();
