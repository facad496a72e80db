import { escapeHtml } from '../escapeHtml.js';

/** A table column: its heading and whether it holds numbers (right-aligned, tabular figures). */
export interface Column {
  heading: string;
  numeric?: boolean;
  /** Show cells as code (tokens, fingerprints). */
  code?: boolean;
  /** Cells the page's script rewrites: `data-live` with this name, `data-row` with the row's first cell. */
  live?: string;
}

/** An HTML table with a caption; every heading and cell is escaped. */
export function htmlTable(caption: string, columns: readonly Column[], rows: ReadonlyArray<readonly string[]>): string {
  const head = columns.map((c) => `<th scope="col"${c.numeric === true ? ' class="num"' : ''}>${escapeHtml(c.heading)}</th>`).join('');
  const body = rows
    .map((row) => {
      const cells = columns.map((c, i) => {
        const text = escapeHtml(row[i] ?? '');
        const content = c.code === true ? `<code>${text}</code>` : text;
        const live = c.live === undefined ? '' : ` data-live="${escapeHtml(c.live)}" data-row="${escapeHtml(row[0] ?? '')}"`;
        return i === 0 ? `<th scope="row"${c.numeric === true ? ' class="num"' : ''}>${content}</th>` : `<td${c.numeric === true ? ' class="num"' : ''}${live}>${content}</td>`;
      });
      return `<tr>${cells.join('')}</tr>`;
    })
    .join('\n');
  return `<table><caption>${escapeHtml(caption)}</caption><thead><tr>${head}</tr></thead><tbody>\n${body}\n</tbody></table>`;
}
