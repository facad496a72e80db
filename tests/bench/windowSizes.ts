/** The sizes of the long texts whose shaped encode the benchmark times (UTF-8 bytes), by name. */
export const WINDOW_TEXT_BYTES: readonly [string, number][] = [
  ['2KiB', 2 * 1024],
  ['32KiB', 32 * 1024],
  ['300KiB', 300 * 1024],
];

/** The length of their rows. */
export const WINDOW_LENGTH = 200;
