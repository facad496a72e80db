/** This lexlock's version (the package version). */
export const VERSION = '0.2.0';
