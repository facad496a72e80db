import { LexlockError } from '../LexlockError.js';
import { BAD_TEXT_POLICIES, type BadTextPolicy } from '../artifact/badTextPolicy.js';
import { firstInvalidUtf8 } from '../artifact/firstInvalidUtf8.js';

// The WHATWG Encoding Standard's UTF-8 decoder, which TextDecoder implements (browsers and Node alike):
// `fatal` stops at the first bad sequence, the default gives U+FFFD for each maximal bad subpart. Both
// drop one leading byte order mark, as the corpus readers drop a file's.
const strict = new TextDecoder('utf-8', { fatal: true });
const replacing = new TextDecoder('utf-8');

/**
 * One document's UTF-8 bytes as text under a bad-text policy, the way the corpus readers decode a file
 * of a folder corpus: a leading byte order mark is dropped; valid UTF-8 is decoded as is; otherwise
 * `replace` gives U+FFFD for each bad sequence, `fail` throws `BAD_UTF8` naming the first bad byte, and
 * `skip` (which leaves such a document out of a corpus) throws `SKIPPED_TEXT`, so that serving code
 * leaves it out too. Browser-safe.
 * @example decodeBytes(new Uint8Array([0x6c, 0xff, 0x61]), 'replace') // 'l\uFFFDa'
 */
export function decodeBytes(bytes: Uint8Array, policy: BadTextPolicy): string {
  if (policy === 'replace') return replacing.decode(bytes);
  if (policy !== 'fail' && policy !== 'skip') {
    throw new LexlockError('BAD_OPTION', `badText: "${String(policy)}" is not one of ${BAD_TEXT_POLICIES.join(', ')}`, { field: 'badText' });
  }
  try {
    return strict.decode(bytes);
  } catch (e) {
    if (!(e instanceof TypeError)) throw e;
  }
  const at = Math.max(firstInvalidUtf8(bytes), 0);
  if (policy === 'fail') {
    throw new LexlockError(
      'BAD_UTF8',
      `invalid UTF-8 at byte ${at}; send UTF-8 text, or pass badText 'replace' to decode it with U+FFFD for each bad sequence`,
      { byteOffset: at },
    );
  }
  throw new LexlockError(
    'SKIPPED_TEXT',
    `invalid UTF-8 at byte ${at}; the bad-text policy skip leaves out a document with invalid UTF-8 (as it left such documents out of the corpus): leave this one out too, or pass badText 'replace'`,
    { byteOffset: at },
  );
}
