/**
 * Colours from a palette that stays distinguishable with the common colour-vision deficiencies;
 * every series also differs by pattern or label, never by colour alone. `primary` (blue #0072B2),
 * `accent` (vermillion #D55E00) and `second` (orange #E69F00) are from Okabe & Ito, "Color Universal
 * Design" (2008; the values from memory); the light tints, inks and greys are our own.
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
