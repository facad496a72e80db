// Run by tests/corpus/notRegularFile.test.ts in a child process, so that a read which blocks the
// thread (as opening a FIFO with no writer used to) fails that test instead of hanging the runner.
// Arguments: root, slowReadMs, then the relative paths. Prints one JSON line: the texts read and
// the error thrown ({ code, message, where } of a LexlockError, or the text of anything else).
import { folderFiles } from '../../src/corpus/folderFiles.js';
import { isLexlockError } from '../../src/LexlockError.js';

const [root, slow, ...paths] = process.argv.slice(2) as [string, string, ...string[]];
const read: string[] = [];
let error: unknown = null;
try {
  for await (const f of folderFiles(root, paths, Number(slow))) read.push(f.bytes.toString());
} catch (e) {
  error = isLexlockError(e) ? { code: e.code, message: e.message, where: e.where } : String(e);
}
process.stdout.write(`${JSON.stringify({ read, error })}\n`);
