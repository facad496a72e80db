/**
 * The longest shape a lexicon may store: 2^20 ids a row (4 MiB as Int32), past the longest input any
 * sequence model takes. Our own limit: every encode allocates a whole row, so a file asking for far
 * more (up to the 2^53 a JSON number holds) would make each encode fail or take gigabytes. Kept apart
 * from schema.ts so that Shape and OovPositions, and with them the worker threads, do not load zod
 * (about 45 ms of a worker's start).
 */
export const MAX_SHAPE_LENGTH = 2 ** 20;
