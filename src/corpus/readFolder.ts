import type { CorpusDocument } from './CorpusDocument.js';
import type { ReadContext } from './ReadContext.js';
import { decodeText, type TextStart } from './decodeText.js';
import { folderFiles } from './folderFiles.js';
import { listFolder } from './listFolder.js';
import { utf8BomLength } from './utf8Bom.js';

/**
 * A folder corpus: every regular, non-hidden file below the folder is one document, in JavaScript
 * string order of its relative path (see {@link listFolder}); its label is the first folder under the
 * root (files right in the root have none). A file's BOM is dropped; bad bytes follow the policy; a
 * file of more than `context.maxRecordBytes` is `RECORD_TOO_LARGE`.
 */
export async function* readFolder(context: ReadContext): AsyncGenerator<CorpusDocument[], void, undefined> {
  context.empty = {
    reason: 'no regular, non-hidden files below it',
    advice: 'put one document in each file, in subfolders named after the labels if there are labels',
  };
  const paths = await listFolder(context.file);
  for await (const read of folderFiles(context.file, paths, undefined, context.maxRecordBytes)) {
    const { relative, file } = read;
    let bytes = read.bytes;
    context.stats.bytes += bytes.length;
    const bom = utf8BomLength(bytes);
    const start: TextStart = { line: 1, byteOffset: bom };
    if (bom > 0) bytes = bytes.subarray(bom);
    const text = decodeText(bytes, start, { badText: context.badText, stats: context.stats, file });
    if (text === null) continue;
    const slash = relative.indexOf('/');
    yield [slash === -1 ? { text, key: relative, where: { file } } : { text, label: relative.slice(0, slash), key: relative, where: { file } }];
  }
}
