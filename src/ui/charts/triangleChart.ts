// The power triangle at the point of connection: P along, Q up (absorbed, lagging) or down
// (delivered, leading), S the hypotenuse; before compensation and after, on one scale.
import { svg } from '../dom.ts';
import { formatNumber } from '../format/numberFormat.ts';
import { cosPhi, niceCeil, type Triangle, type TrianglePoint } from './chartData.ts';

export function triangleChart(t: Triangle, width = 360, height = 220): SVGSVGElement {
  const pts = [t.before, ...(t.after ? [t.after] : [])];
  const pMax = niceCeil(Math.max(1, ...pts.map((x) => Math.abs(x.p))));
  const qMax = niceCeil(Math.max(1, ...pts.map((x) => Math.abs(x.q))));
  const left = 44, right = width - 16, top = 16, bottom = height - 26;
  const s = Math.min((right - left) / pMax, (bottom - top) / 2 / qMax);
  const y0 = (top + bottom) / 2;
  const X = (p: number) => left + Math.abs(p) * s;
  const Y = (q: number) => y0 - q * s;
  const root = svg('svg', { viewBox: `0 0 ${width} ${height}`, width, height, class: 'kl-chart kl-triangle', role: 'img', 'aria-label': `Power triangle at ${t.bus}` });
  root.append(
    svg('line', { x1: left, x2: right, y1: y0, y2: y0, class: 'kl-axis' }),
    svg('line', { x1: left, x2: left, y1: top, y2: bottom, class: 'kl-axis' }),
    svg('text', { x: left - 6, y: top + 8, class: 'kl-axis-label', 'text-anchor': 'end' }, 'lag'),
    svg('text', { x: left - 6, y: bottom, class: 'kl-axis-label', 'text-anchor': 'end' }, 'lead'),
    svg('text', { x: right, y: height - 8, class: 'kl-axis-label', 'text-anchor': 'end' }, `P (kW), scale to ${formatNumber(pMax, '0')}`),
  );
  const draw = (pt: TrianglePoint, cls: string) => {
    const x = X(pt.p), y = Y(pt.q);
    root.append(
      svg('polygon', { points: `${left},${y0} ${x},${y0} ${x},${y}`, class: `kl-tri ${cls}` }),
      svg('line', { x1: left, y1: y0, x2: x, y2: y, class: `kl-tri-s ${cls}` }),
      svg('circle', { cx: x, cy: y, r: 3, class: `kl-tri-dot ${cls}` }),
    );
  };
  draw(t.before, 'is-before');
  if (t.after) draw(t.after, 'is-after');
  return root;
}

export interface TriangleRow {
  readonly label: string;
  readonly p: string;
  readonly q: string;
  readonly s: string;
  readonly cos: string;
}

export function triangleRows(t: Triangle): TriangleRow[] {
  const row = (label: string, x: TrianglePoint): TriangleRow => {
    const c = cosPhi(x);
    return {
      label,
      p: formatNumber(x.p, '0.0'),
      q: formatNumber(x.q, '0.0'),
      s: formatNumber(Math.hypot(x.p, x.q), '0.0'),
      cos: c === undefined ? '—' : `${formatNumber(c, '0.000')} ${x.q > 0 ? 'lagging' : x.q < 0 ? 'leading' : ''}`.trim(),
    };
  };
  return [row('before', t.before), ...(t.after ? [row('after', t.after)] : [])];
}
