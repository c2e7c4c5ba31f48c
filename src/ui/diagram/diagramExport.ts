// The diagram as a file of its own: the SVG with the diagram's stylesheet inside it and a
// footer that says what it is, so it reads the same in a browser, a drawing program or a report.
import diagramCss from '../styles/diagram.css?raw';
import { svg } from '../dom.ts';

export const EXPORT_FOOTER =
  'Estimate for pricing and planning, not a design document: the final design follows local codes, the utility and a licensed engineer.';

/** A standalone SVG document of `drawn` (left untouched), with `heading` and the footer. */
export function standaloneSvg(drawn: SVGSVGElement, heading: string): string {
  const copy = drawn.cloneNode(true) as SVGSVGElement;
  const [x, y, w, h] = (copy.getAttribute('viewBox') ?? '0 0 0 0').split(/\s+/).map(Number) as [
    number,
    number,
    number,
    number,
  ];
  const head = 30,
    foot = 30;
  copy.setAttribute('viewBox', `${x} ${y - head} ${w} ${h + head + foot}`);
  copy.setAttribute('width', String(w));
  copy.setAttribute('height', String(h + head + foot));
  copy.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  for (const n of copy.querySelectorAll('[tabindex]')) n.removeAttribute('tabindex');
  const style = svg('style', {}, diagramCss);
  copy.prepend(
    style,
    svg('rect', { x, y: y - head, width: w, height: h + head + foot, class: 'kl-dg-band' }),
  );
  copy.append(
    svg('text', { x: 8, y: y - 10, class: 'kl-dg-name' }, heading),
    svg('text', { x: 8, y: y + h + 20, class: 'kl-dg-items' }, EXPORT_FOOTER),
  );
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(copy)}\n`;
}
