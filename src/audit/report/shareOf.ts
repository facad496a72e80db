/** `part / whole`, or 0 when the whole is 0 (an empty corpus has no OOV rate to speak of). */
export function shareOf(part: number, whole: number): number {
  return whole > 0 ? part / whole : 0;
}
