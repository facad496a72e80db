import { svgTag } from './svgTag.js';

/**
 * A `<pattern>` of diagonal stripes in `colour` over `background`, for fills that must differ from
 * solid ones without relying on colour. Use it as `fill="url(#id)"` (a same-document reference).
 */
export function hatchPattern(id: string, colour: string, background: string): string {
  return svgTag(
    'pattern',
    { id, patternUnits: 'userSpaceOnUse', width: 6, height: 6, patternTransform: 'rotate(45)' },
    svgTag('rect', { width: 6, height: 6, fill: background }) + svgTag('line', { x1: 0, y1: 0, x2: 0, y2: 6, stroke: colour, 'stroke-width': 3 }),
  );
}
