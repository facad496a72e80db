// RowPool's draws are Fisher-Yates as the PCG reference's demo deals cards (pcg-c-basic pcg32-demo,
// seeded pcg32_srandom_r(42, 54), after its six 32-bit outputs, 65 coins and 33 rolls; quoted from
// memory of that output, and the same deal Pcg32.test.ts checks). A pool holding cards 0..51 as rows
// gives out the deal from its last card to its first: the demo puts the card it draws at position
// i-1, the pool sends it out at once.
import { describe, expect, it } from 'vitest';
import { BatchBuffer } from '../../src/training/BatchBuffer.js';
import { Pcg32 } from '../../src/training/Pcg32.js';
import { RowPool } from '../../src/training/RowPool.js';

const DEMO_CARDS =
  'Qd Ks 6d 3s 3d 4c 3h Td Kc 5c Jh Kd Jd As 4s 4h Ad Th Ac Jc 7s Qs 2s 7h Kh 2d 6c Ah 4d Qh 9h 6s 5s 2c 9c Ts 8d 9s 3c 8c Js 5d 2h 6h 7d 8s 9d 5h 8h Qc 7c Tc';
const cardName = (c: number) => 'A23456789TJQK'[Math.floor(c / 4)]! + 'hcds'[c % 4]!;

describe('RowPool', () => {
  it('drains in the order of the reference demo deal, reversed', () => {
    const rng = new Pcg32(42, 54);
    for (let i = 0; i < 6; i++) rng.next();
    for (let i = 0; i < 65; i++) rng.below(2);
    for (let i = 0; i < 33; i++) rng.below(6);
    // Rows of 2 ids: the card and its number + 100, so the copy of whole rows is checked too.
    const pool = new RowPool(52, 2, rng);
    const batch = new BatchBuffer(52, 2);
    for (let c = 0; c < 52; c++) pool.offer(Int32Array.of(c, c + 100), c % 3, c % 5, `card ${c}`, batch);
    expect(batch.rows).toBe(0); // the pool held them all
    while (pool.size > 0) pool.drawInto(batch);
    const dealt = batch.take();
    const cards = Array.from({ length: 52 }, (_, r) => dealt.ids[2 * r] as number);
    expect(cards.reverse().map(cardName).join(' ')).toBe(DEMO_CARDS);
    for (let r = 0; r < 52; r++) {
      const c = dealt.ids[2 * r] as number;
      expect([dealt.ids[2 * r + 1], dealt.lengths[r], dealt.labels[r], dealt.keys[r]]).toEqual([c + 100, c % 3, c % 5, `card ${c}`]);
    }
  });

  it('once full, sends a held row out for each row offered, and holds the new one in its slot', () => {
    const pool = new RowPool(3, 1, new Pcg32(9));
    const batch = new BatchBuffer(10, 1);
    for (let i = 0; i < 5; i++) pool.offer(Int32Array.of(i), 1, 0, String(i), batch);
    expect([pool.size, batch.rows]).toEqual([3, 2]);
    while (pool.size > 0) pool.drawInto(batch);
    const out = batch.take();
    expect([...out.keys].sort()).toEqual(['0', '1', '2', '3', '4']);
    expect(out.keys.map(Number)).toEqual(Array.from(out.ids));
    expect(out.rows).toBe(5);
    expect(out.ids.buffer.byteLength).toBe(5 * 4); // a short batch is copied to its exact size
  });
});
