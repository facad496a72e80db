import { MAX_SHAPE_LENGTH } from '../artifact/maxShapeLength.js';
import type { ShapeEnd } from '../lexicon/Shape.js';

/**
 * Token positions whose OOV counts are kept, from either end of a document: as many as the longest
 * row a lexicon can store, so a window of any storable length is counted exactly.
 */
export const OOV_POSITIONS = MAX_SHAPE_LENGTH;

/** The additive form of {@link OovPositions}, as a worker thread sends it. */
export interface OovPositionCounts {
  fromStart: Float64Array;
  fromEnd: Float64Array;
}

/**
 * Where in documents their OOV tokens are: `fromStart[i]` is how many documents have an OOV token at
 * position i (0 = the first token), `fromEnd[j]` how many have one j tokens before the end (0 = the
 * last). So the OOV tokens a row of length L keeps, summed over the corpus, are the first L counts of
 * `fromStart` when long documents lose their end, of `fromEnd` when they lose their start: any L,
 * known once the corpus is read (the candidate lengths are its percentiles). Both arrays are as long
 * as the longest document, at most {@link OOV_POSITIONS} (8 MiB each then), whatever the corpus size.
 */
export class OovPositions implements OovPositionCounts {
  fromStart = new Float64Array(0);
  fromEnd = new Float64Array(0);

  /** Counts one document's ids. */
  add(ids: ArrayLike<number>, oovId: number): void {
    const n = ids.length;
    const m = n < OOV_POSITIONS ? n : OOV_POSITIONS;
    if (m > this.fromStart.length) this.#grow(m);
    const { fromStart, fromEnd } = this;
    for (let i = 0; i < m; i++) {
      if (ids[i] === oovId) fromStart[i] = (fromStart[i] as number) + 1;
      if (ids[n - 1 - i] === oovId) fromEnd[i] = (fromEnd[i] as number) + 1;
    }
  }

  /**
   * Counts one document of `length` tokens whose OOV tokens stand at the first `count` places of
   * `places` (ascending): the same counts as {@link OovPositions.add} of its ids, in time of its OOV tokens.
   */
  addPlaces(places: Int32Array, count: number, length: number): void {
    const m = length < OOV_POSITIONS ? length : OOV_POSITIONS;
    if (m > this.fromStart.length) this.#grow(m);
    const { fromStart, fromEnd } = this;
    for (let p = 0; p < count; p++) {
      const i = places[p] as number;
      if (i < m) fromStart[i] = (fromStart[i] as number) + 1;
      const j = length - 1 - i;
      if (j < m) fromEnd[j] = (fromEnd[j] as number) + 1;
    }
  }

  /** Adds counts made elsewhere (a worker's). */
  merge(other: OovPositionCounts): void {
    const m = other.fromStart.length;
    if (m > this.fromStart.length) this.#grow(m);
    for (let i = 0; i < m; i++) {
      this.fromStart[i] = (this.fromStart[i] as number) + (other.fromStart[i] as number);
      this.fromEnd[i] = (this.fromEnd[i] as number) + (other.fromEnd[i] as number);
    }
  }

  /**
   * OOV tokens kept by rows of `length` (at most {@link OOV_POSITIONS}, or any length when no document
   * is longer than that) when long documents lose their `cut` end.
   */
  keptOov(length: number, cut: ShapeEnd): number {
    const counts = cut === 'end' ? this.fromStart : this.fromEnd;
    const m = Math.min(length, counts.length);
    let sum = 0;
    for (let i = 0; i < m; i++) sum += counts[i] as number;
    return sum;
  }

  /** Room for `m` positions: at least double, so a corpus of growing documents grows the arrays a few times only. */
  #grow(m: number): void {
    const size = Math.min(OOV_POSITIONS, Math.max(m, 2 * this.fromStart.length, 64));
    const fromStart = new Float64Array(size);
    const fromEnd = new Float64Array(size);
    fromStart.set(this.fromStart);
    fromEnd.set(this.fromEnd);
    this.fromStart = fromStart;
    this.fromEnd = fromEnd;
  }
}
