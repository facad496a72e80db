import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LINE_CLEARANCE, labelWidth, placeLabels, type PlacedLabel } from '../../../src/audit/report/svg/placeLabels.js';

/** The horizontal span a placed label's text covers. */
function span(p: PlacedLabel): [number, number] {
  const w = labelWidth(p.text);
  return p.anchor === 'start' ? [p.textX, p.textX + w] : [p.textX - w, p.textX];
}

describe('placeLabels', () => {
  it('puts a lone label right of its line, or left of it near the right edge', () => {
    expect(placeLabels([{ x: 100, text: '90 %' }], 0, 680)).toEqual([{ x: 100, text: '90 %', row: 0, anchor: 'start', textX: 104 }]);
    expect(placeLabels([{ x: 670, text: '99 %' }], 0, 680)).toEqual([{ x: 670, text: '99 %', row: 0, anchor: 'end', textX: 666 }]);
  });

  it('puts crowded labels on both sides of their lines, then on a higher row', () => {
    const placed = placeLabels(
      [
        { x: 300, text: 'a long label number one' },
        { x: 310, text: 'a long label number two' },
        { x: 305, text: 'third' },
      ],
      0,
      680,
    );
    expect(placed.map((p) => [p.row, p.anchor])).toEqual([
      [0, 'end'], // right of its line would cover the next marker's line
      [0, 'start'],
      [1, 'start'],
    ]);
  });

  it('keeps labels clear of other markers\' lines where it can (the coverage chart\'s crowded right end)', () => {
    const requests = [
      { x: 580, text: '90 %' },
      { x: 616, text: '95 %' },
      { x: 648, text: '99 %' },
      { x: 608, text: 'chosen cap 24,000: 95.3 % covered' },
    ];
    const placed = placeLabels(requests, 2, 678);
    for (const label of placed) {
      const [from, to] = span(label);
      expect(from).toBeGreaterThanOrEqual(2);
      expect(to).toBeLessThanOrEqual(678);
      // A line rises from the plot to its own label's row: it crosses every lower row.
      for (const other of placed) if (other !== label && other.row > label.row) expect(other.x < from - LINE_CLEARANCE || other.x > to + LINE_CLEARANCE).toBe(true);
    }
    expect(placed.at(-1)?.row).toBe(1);
  });

  it('never lets two labels on one row overlap', () => {
    const request = fc.record({ x: fc.double({ min: 0, max: 680, noNaN: true }), text: fc.string({ minLength: 1, maxLength: 30 }) });
    fc.assert(
      fc.property(fc.array(request, { maxLength: 12 }), (requests) => {
        const placed = placeLabels(requests, 0, 680);
        expect(placed.map((p) => p.text)).toEqual(requests.map((r) => r.text));
        for (let i = 0; i < placed.length; i++) {
          for (let j = i + 1; j < placed.length; j++) {
            const a = placed[i];
            const b = placed[j];
            if (a === undefined || b === undefined || a.row !== b.row) continue;
            const [a0, a1] = span(a);
            const [b0, b1] = span(b);
            expect(a1 <= b0 || b1 <= a0).toBe(true);
          }
        }
      }),
    );
  });
});
