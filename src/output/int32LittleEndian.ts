/** True when this host stores numbers little-endian (x86, most ARM). */
export const HOST_LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/**
 * The bytes of `ids` in little-endian order. On a little-endian host this is a view of the same
 * memory (no copy); elsewhere a converted copy. `hostLittleEndian` is there for tests.
 */
export function int32LittleEndian(ids: Int32Array, hostLittleEndian: boolean = HOST_LITTLE_ENDIAN): Uint8Array {
  if (hostLittleEndian) return new Uint8Array(ids.buffer, ids.byteOffset, ids.byteLength);
  const out = new Uint8Array(ids.byteLength);
  const view = new DataView(out.buffer);
  for (let i = 0; i < ids.length; i++) view.setInt32(i * 4, ids[i] as number, true);
  return out;
}
