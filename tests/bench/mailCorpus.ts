import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { inventedWord } from './inventedWord.js';
import { pickOne, randomHex, randomInt, seededRandom, type Random } from './seededRandom.js';
import { zipfRank } from './zipfRank.js';

/** The folders (labels) of the mail-like corpus. */
export const MAIL_LABELS: readonly string[] = ['billing', 'crossings', 'lost-property', 'newsletter', 'support'];

/** Average size of one generated message in bytes; 6,000 messages make about 32 MB. */
export const MAIL_MEAN_BYTES = 5_333;

const COMMON = ['the', 'and', 'to', 'of', 'a', 'in', 'is', 'for', 'on', 'you', 'we', 'it', 'with', 'your', 'this', 'be', 'are', 'not', 'please', 'thanks', 'can', 'will', 'have', 'our', 'ticket', 'order', 'ferry', 'crossing', 'refund', 'booking'];
const DAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const DOMAINS = ['example.com', 'example.org', 'example.net', 'mail.example.com', 'harbour.example.org'];
const ODD = ['café', 'grüße', 'naïve', 'Ωmega', 'Привет', '東京', 'ｆｕｌｌｗｉｄｔｈ', '½', 'ﬁle'];

function capitalized(word: string): string {
  return word.charAt(0).toUpperCase() + word.slice(1);
}

function person(random: Random): { name: string; address: string } {
  const first = inventedWord(randomInt(random, 200, 3000));
  const last = inventedWord(randomInt(random, 3000, 40000));
  return { name: `${capitalized(first)} ${capitalized(last)}`, address: `${first}.${last}@${pickOne(random, DOMAINS)}` };
}

function date(random: Random): string {
  const hh = String(randomInt(random, 0, 23)).padStart(2, '0');
  const mm = String(randomInt(random, 0, 59)).padStart(2, '0');
  const ss = String(randomInt(random, 0, 59)).padStart(2, '0');
  return `${pickOne(random, DAYS)}, ${randomInt(random, 1, 28)} ${pickOne(random, MONTHS)} ${randomInt(random, 2019, 2025)} ${hh}:${mm}:${ss} +0000`;
}

function word(random: Random): string {
  const r = random();
  if (r < 0.35) return pickOne(random, COMMON);
  if (r < 0.95) return inventedWord(zipfRank(random, 30_000, 1.1) - 1);
  if (r < 0.97) return String(randomInt(random, 0, 99_999));
  if (r < 0.98) return `${randomInt(random, 1, 999)},${String(randomInt(random, 0, 999)).padStart(3, '0')}.${String(randomInt(random, 0, 99)).padStart(2, '0')}`;
  if (r < 0.99) return `REF-${randomInt(random, 10_000, 99_999)}-${randomHex(random, 4).toUpperCase()}`; // one-off ids
  if (r < 0.995) return `https://www.${pickOne(random, DOMAINS)}/track/${randomHex(random, 10)}?ref=${randomInt(random, 1, 9999)}`;
  if (r < 0.998) return person(random).address;
  return pickOne(random, ODD);
}

function sentence(random: Random): string {
  const words: string[] = [];
  const n = randomInt(random, 5, 22);
  for (let i = 0; i < n; i++) words.push(word(random));
  const first = words[0] ?? '';
  words[0] = capitalized(first);
  return words.join(random() < 0.15 ? ', ' : ' ') + pickOne(random, ['.', '.', '.', '?', '!', ' :)']);
}

function paragraph(random: Random, prefix: string): string {
  const lines: string[] = [];
  const n = randomInt(random, 1, 5);
  for (let i = 0; i < n; i++) lines.push(prefix + sentence(random));
  return lines.join('\n');
}

function headers(random: Random, from: { name: string; address: string }, to: { name: string; address: string }): string {
  const lines: string[] = [];
  const hops = randomInt(random, 2, 5);
  for (let i = 0; i < hops; i++) {
    const host = `mx${randomInt(random, 1, 40)}.${pickOne(random, DOMAINS)}`;
    lines.push(`Received: from ${host} (${host} [192.0.2.${randomInt(random, 1, 254)}])\n\tby relay${randomInt(random, 1, 9)}.example.net with ESMTPS id ${randomHex(random, 12).toUpperCase()}\n\tfor <${to.address}>; ${date(random)}`);
  }
  lines.push(`Message-ID: <${randomHex(random, 16)}.${randomInt(random, 1000, 999_999)}@mail.example.com>`);
  if (random() < 0.6) lines.push(`In-Reply-To: <${randomHex(random, 16)}@mail.example.org>`);
  lines.push(`Date: ${date(random)}`);
  lines.push(`From: "${from.name}" <${from.address}>`);
  lines.push(`To: "${to.name}" <${to.address}>`);
  lines.push(`Subject: ${random() < 0.5 ? 'Re: ' : ''}${sentence(random)}`);
  lines.push(`X-Spam-Score: ${(random() * 10).toFixed(1)}`);
  lines.push(`X-Request-Id: ${randomHex(random, 8)}-${randomHex(random, 4)}-${randomHex(random, 4)}-${randomHex(random, 12)}`);
  lines.push('Content-Type: text/plain; charset=utf-8');
  lines.push(`DKIM-Signature: v=1; a=rsa-sha256; d=example.com; s=sel${randomInt(random, 1, 9)};\n\tbh=${randomHex(random, 44)};\n\tb=${randomHex(random, 64)}\n\t${randomHex(random, 64)}`);
  return lines.join('\n');
}

/**
 * One invented mail message: long headers (relay hops, ids, hex signatures), a body of Zipf-distributed
 * invented words with numbers, reference ids, URLs and addresses on example domains, a signature and
 * quoted replies, about {@link MAIL_MEAN_BYTES} bytes on average.
 */
export function mailMessage(random: Random): string {
  const from = person(random);
  const to = person(random);
  const target = Math.min(60_000, 1_400 + Math.round(-Math.log(1 - random()) * (MAIL_MEAN_BYTES - 1_500)));
  const parts: string[] = [headers(random, from, to), ''];
  let size = (parts[0] ?? '').length;
  let depth = 0;
  while (size < target) {
    const quoted = depth > 0 && random() < 0.7;
    const text =
      random() < 0.12
        ? `On ${date(random)}, ${person(random).name} <${person(random).address}> wrote:`
        : paragraph(random, quoted ? '> '.repeat(depth) : '');
    if (text.endsWith('wrote:')) depth = Math.min(depth + 1, 4);
    parts.push(text, '');
    size += text.length + 2;
    if (!quoted && depth === 0 && random() < 0.2) parts.push(`-- \n${from.name}\nCustomer desk, ${randomInt(random, 1, 400)} Harbour Road\nhttps://${pickOne(random, DOMAINS)}/help`);
  }
  return parts.join('\n');
}

/** What a corpus writer produced. */
export interface WrittenCorpus {
  /** Documents written (files, rows or lines). */
  documents: number;
  /** Bytes written, all files together. */
  bytes: number;
}

/**
 * Writes `files` mail messages into `folder`, one file per message under a label folder
 * (`support/000042.eml`): a folder corpus. The same seed always writes the same bytes.
 */
export async function writeMailCorpus(folder: string, options: { files: number; seed: number }): Promise<WrittenCorpus> {
  const random = seededRandom(options.seed);
  for (const label of MAIL_LABELS) await mkdir(join(folder, label), { recursive: true });
  let bytes = 0;
  for (let i = 0; i < options.files; i++) {
    const label = pickOne(random, MAIL_LABELS);
    const data = Buffer.from(mailMessage(random), 'utf8');
    bytes += data.byteLength;
    await writeFile(join(folder, label, `${String(i).padStart(6, '0')}.eml`), data);
  }
  return { documents: options.files, bytes };
}
