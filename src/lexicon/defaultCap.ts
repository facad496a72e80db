/** The vocabulary cap when none is given, in the library and on the command line. */
export const DEFAULT_CAP = 30000;
