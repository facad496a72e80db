import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HOST_LITTLE_ENDIAN, int32LittleEndian } from '../../src/output/int32LittleEndian.js';

/** Reference: DataView.setInt32 with littleEndian = true (ECMAScript spec, SetValueInBuffer). */
function viaDataView(ids: Int32Array): number[] {
  const view = new DataView(new ArrayBuffer(ids.length * 4));
  ids.forEach((v, i) => view.setInt32(i * 4, v, true));
  return [...new Uint8Array(view.buffer)];
}

describe('int32LittleEndian', () => {
  it.each([true, false])('hostLittleEndian=%s gives two\'s complement, least significant byte first', (host) => {
    // Two's complement little-endian layouts (common practice): 1 -> 01 00 00 00, -1 -> ff ff ff ff,
    // 0x01020304 -> 04 03 02 01, -2^31 -> 00 00 00 80, 2^31-1 -> ff ff ff 7f.
    const ids = new Int32Array([1, -1, 0x01020304, -(2 ** 31), 2 ** 31 - 1]);
    expect([...int32LittleEndian(ids, host)]).toEqual([
      1, 0, 0, 0, 0xff, 0xff, 0xff, 0xff, 4, 3, 2, 1, 0, 0, 0, 0x80, 0xff, 0xff, 0xff, 0x7f,
    ]);
  });

  it('matches DataView on both paths for any values and offsets (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -(2 ** 31), max: 2 ** 31 - 1 })), fc.nat(3), (values, skip) => {
        const whole = new Int32Array([...Array.from({ length: skip }, () => 99), ...values]);
        const ids = whole.subarray(skip);
        expect([...int32LittleEndian(ids, true)]).toEqual(viaDataView(ids));
        expect([...int32LittleEndian(ids, false)]).toEqual(viaDataView(ids));
      }),
    );
  });

  it('knows this host (Node on x86 and ARM runs little-endian)', () => {
    expect(HOST_LITTLE_ENDIAN).toBe(new Uint8Array(new Uint16Array([0x0102]).buffer)[0] === 0x02);
  });
});
