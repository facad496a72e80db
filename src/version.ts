/** This lexlock's version (the package version). */
export const VERSION = '0.1.0';
