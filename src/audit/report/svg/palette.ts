/**
 * Colours from a palette that stays distinguishable with the common colour-vision deficiencies;
 * every series also differs by pattern or label, never by colour alone.
 */
export const PALETTE = {
  ink: '#1f2328',
  muted: '#5c6570',
  grid: '#d8dde3',
  primary: '#0072b2',
  primaryLight: '#cfe3f1',
  accent: '#d55e00',
  accentLight: '#f7dccb',
  second: '#e69f00',
  suggestion: '#6b7785',
} as const;
