import { escapeHtml } from '../escapeHtml.js';
import { svgTag } from './svgTag.js';

/** What {@link chartSvg} wraps: an id unique in the page, accessible title and description, defs and body. */
export interface ChartSvgParts {
  id: string;
  width: number;
  height: number;
  title: string;
  description: string;
  defs?: string;
  body: string;
}

/** An accessible `<svg role="img">` with a `<title>` and `<desc>`, scaled to its container's width. */
export function chartSvg(parts: ChartSvgParts): string {
  const titleId = `${parts.id}-title`;
  const descId = `${parts.id}-desc`;
  const content =
    svgTag('title', { id: titleId }, escapeHtml(parts.title)) +
    svgTag('desc', { id: descId }, escapeHtml(parts.description)) +
    (parts.defs === undefined || parts.defs === '' ? '' : `<defs>${parts.defs}</defs>`) +
    parts.body;
  return svgTag(
    'svg',
    {
      class: 'chart',
      id: parts.id,
      role: 'img',
      'aria-labelledby': `${titleId} ${descId}`,
      viewBox: `0 0 ${parts.width} ${parts.height}`,
      width: parts.width,
      height: parts.height,
    },
    content,
  );
}
