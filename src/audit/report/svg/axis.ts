/** A function from data values to pixel positions. */
export type Scale = (value: number) => number;

/** Removes binary floating-point noise from a tick value (0.30000000000000004 -> 0.3). */
function clean(value: number): number {
  return Number(value.toPrecision(12));
}

/** Tolerance for rounding a ratio of floating-point numbers to a whole number of steps. */
function slack(ratio: number): number {
  return 1e-9 + Math.abs(ratio) * 1e-13;
}

/**
 * A round step near `span / target`: 1, 2, 5 or 10 times a power of ten (cut-offs 1.5, 3 and 7).
 * @example niceStep(100, 5) // 20
 */
export function niceStep(span: number, target = 5): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / Math.max(1, target);
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const f = raw / magnitude;
  const nice = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
  return clean(nice * magnitude);
}

/**
 * Round tick values from `min` to `max` (both included when they fall on a step), about `target` of them.
 * @example niceTicks(0, 100) // [0, 20, 40, 60, 80, 100]
 */
export function niceTicks(min: number, max: number, target = 5): number[] {
  if (!(max > min)) return [clean(min)];
  const step = niceStep(max - min, target);
  const first = Math.ceil(min / step - slack(min / step));
  const last = Math.floor(max / step + slack(max / step));
  const ticks: number[] = [];
  for (let k = first; k <= last; k++) ticks.push(clean(k * step));
  return ticks;
}

/** A value axis from 0: its round top value and its ticks, all on one step grid. */
export interface ZeroAxis {
  top: number;
  ticks: number[];
}

/**
 * An axis from 0 to the smallest multiple of {@link niceStep}(max) at or above `max`, with a tick per step.
 * @example zeroAxis(37) // { top: 40, ticks: [0, 10, 20, 30, 40] }
 */
export function zeroAxis(max: number, target = 5): ZeroAxis {
  if (!(max > 0) || !Number.isFinite(max)) return { top: 1, ticks: [0, 1] };
  const step = niceStep(max, target);
  const steps = Math.ceil(max / step - slack(max / step));
  const ticks: number[] = [];
  for (let k = 0; k <= steps; k++) ticks.push(clean(k * step));
  return { top: clean(steps * step), ticks };
}

/** Log-scale ticks: `major` are the powers of ten in range, `minor` the 2…9 multiples between them. */
export interface LogTicks {
  major: number[];
  minor: number[];
}

/**
 * Ticks for a log scale over [min, max] (min > 0). When fewer than two powers of ten fall in range,
 * the 2 and 5 multiples become major ticks too.
 * @example logTicks(1, 5000).major // [1, 10, 100, 1000]
 */
export function logTicks(min: number, max: number): LogTicks {
  if (!(min > 0) || !(max >= min)) return { major: [], minor: [] };
  const lo = Math.floor(Math.log10(min));
  const hi = Math.ceil(Math.log10(max));
  const inRange = (v: number): boolean => v >= clean(min) && v <= clean(max);
  const decades: number[] = [];
  const between: number[] = [];
  for (let e = lo; e <= hi; e++) {
    for (let m = 1; m <= 9; m++) {
      const v = clean(m * 10 ** e);
      if (!inRange(v)) continue;
      (m === 1 ? decades : between).push(v);
    }
  }
  if (decades.length >= 2) return { major: decades, minor: between };
  const promoted = between.filter((v) => {
    const m = Math.round(v / 10 ** Math.floor(Math.log10(v)));
    return m === 2 || m === 5;
  });
  return {
    major: [...decades, ...promoted].sort((a, b) => a - b),
    minor: between.filter((v) => !promoted.includes(v)),
  };
}

/** A linear scale from the domain [d0, d1] onto the range [r0, r1]. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): Scale {
  const span = d1 - d0;
  return (v) => (span === 0 ? (r0 + r1) / 2 : r0 + ((v - d0) / span) * (r1 - r0));
}

/** A log-10 scale from the domain [d0, d1] (both > 0) onto the range [r0, r1]. */
export function logScale(d0: number, d1: number, r0: number, r1: number): Scale {
  const l0 = Math.log10(d0);
  const span = Math.log10(d1) - l0;
  return (v) => (span === 0 ? (r0 + r1) / 2 : r0 + ((Math.log10(v) - l0) / span) * (r1 - r0));
}

/** The smallest and largest of `values`, or null when there are none (safe for long arrays). */
export function extent(values: readonly number[]): [number, number] | null {
  if (values.length === 0) return null;
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return [lo, hi];
}
