/**
 * The values a page control may stop at: every whole value from 0 to `exactTo`, then every `step`
 * after it, `last` itself and the `extra` values (the audited cap or length). Figures summed between
 * stops are exact at every stop, so a control that stops only there never shows an estimate.
 */
export interface StopGrid {
  exactTo: number;
  step: number;
  last: number;
  extra: number[];
}

/** Steps a grid may take past its exact part: 1, 2, 5 times a power of ten (easy to read on the page). */
function roundStep(wanted: number): number {
  for (let power = 1; ; power *= 10) {
    for (const m of [1, 2, 5]) if (m * power >= wanted) return m * power;
  }
}

/**
 * A grid from 0 to `last` with at most `points` stops (at least 8): every value when they fit, else
 * the first half of the stops one apart and the rest `step` apart, `step` a round number.
 * @example stopGrid(100_000, 1_000, [12_345]) // { exactTo: 500, step: 500, last: 100000, extra: [12345] }
 */
export function stopGrid(last: number, points: number, extra: readonly number[] = []): StopGrid {
  const room = Math.max(8, Math.floor(points));
  const kept = [...new Set(extra.filter((v) => Number.isInteger(v) && v >= 0 && v <= last))].sort((a, b) => a - b);
  if (last + 1 <= room) return { exactTo: last, step: 1, last, extra: [] };
  const exactTo = Math.floor(room / 2);
  // Stops past exactTo: the regular ones, `last` and the extras must fit in what is left.
  const regular = Math.max(1, room - exactTo - 1 - kept.length - 1);
  const step = roundStep((last - exactTo) / regular);
  return { exactTo, step, last, extra: kept.filter((v) => v > exactTo && (v - exactTo) % step !== 0 && v !== last) };
}

/** Every stop of a grid, ascending, each once. */
export function stopsOf(grid: StopGrid): number[] {
  const out: number[] = [];
  for (let v = 0; v <= Math.min(grid.exactTo, grid.last); v++) out.push(v);
  for (let v = grid.exactTo + grid.step; v < grid.last; v += grid.step) out.push(v);
  if (grid.last > grid.exactTo) out.push(grid.last);
  for (const e of grid.extra) out.push(e);
  return [...new Set(out)].sort((a, b) => a - b);
}

/**
 * Finds, for a value, the first stop at or above it: the bucket a rank or a length is summed in. The
 * exact part is the value itself; past it, one division and a walk back over the few extra stops.
 */
export class StopIndex {
  readonly grid: StopGrid;
  readonly stops: readonly number[];
  /** Index in {@link stops} of the k-th regular stop past `exactTo` (the last one: `last`). */
  readonly #regular: Int32Array;

  constructor(grid: StopGrid) {
    this.grid = grid;
    this.stops = stopsOf(grid);
    const count = grid.last > grid.exactTo ? Math.ceil((grid.last - grid.exactTo) / grid.step) : 0;
    this.#regular = new Int32Array(count + 1);
    let at = 0;
    for (let k = 1; k <= count; k++) {
      const value = Math.min(grid.exactTo + k * grid.step, grid.last);
      while ((this.stops[at] as number) < value) at++;
      this.#regular[k] = at;
    }
  }

  /** The index of the first stop at or above `value` (`stops.length` past the last stop). */
  bucketOf(value: number): number {
    const grid = this.grid;
    if (value <= grid.exactTo) return value <= grid.last ? value : this.stops.length;
    if (value > grid.last) return this.stops.length;
    let index = this.#regular[Math.ceil((value - grid.exactTo) / grid.step)] as number;
    while (index > 0 && (this.stops[index - 1] as number) >= value) index--;
    return index;
  }
}
