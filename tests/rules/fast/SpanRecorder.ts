import { TOKEN_TYPES } from '../../../src/rules/TextRules.js';
import type { SpanSink } from '../../../src/rules/TokenSpans.js';

/** A SpanSink for tests: keeps what the scanners report as value/tag pairs (wink's form) and as spans. */
export class SpanRecorder implements SpanSink {
  readonly pairs: string[] = [];
  readonly spans: [number, number, string][] = [];

  constructor(readonly text: string) {}

  span(from: number, to: number, type: number): void {
    const tag = TOKEN_TYPES[type] ?? `unknown type ${type}`;
    this.pairs.push(this.text.slice(from, to), tag);
    this.spans.push([from, to, tag]);
  }
}
