// The power triangle at the point of connection: P along, Q up (absorbed, lagging) or down
// (delivered, leading), S the hypotenuse; before and after compensation on one true-to-angle
// scale, so the change of φ is what the eye sees.
import { svg } from '../dom.ts';
import { formatNumber } from '../format/numberFormat.ts';
import { cosPhi, type Triangle, type TrianglePoint } from './chartData.ts';

export function triangleChart(t: Triangle, width = 380): SVGSVGElement {
  const pts = [t.before, ...(t.after ? [t.after] : [])];
  const pMax = Math.max(1, ...pts.map((x) => Math.abs(x.p)));
  const qUp = Math.max(0, ...pts.map((x) => x.q));
  const qDown = Math.max(0, ...pts.map((x) => -x.q));
  const left = 44,
    right = width - 178,
    top = 16;
  // One scale for P and Q keeps the angle φ true; the drawing is as tall as the triangles need.
  const s = Math.min((right - left) / pMax, 170 / Math.max(1, qUp + qDown));
  const y0 = top + qUp * s;
  const height = Math.max(80, y0 + qDown * s + 34);
  const X = (p: number) => left + Math.abs(p) * s;
  const Y = (q: number) => y0 - q * s;
  const root = svg('svg', {
    viewBox: `0 0 ${width} ${height}`,
    width,
    height,
    class: 'kl-chart kl-triangle',
    role: 'img',
    'aria-label': `Power triangle at ${t.bus}`,
  });
  root.append(
    svg('line', { x1: left, x2: X(pMax) + 8, y1: y0, y2: y0, class: 'kl-axis' }),
    // How to read it, under the drawing where it cannot collide with the triangles.
    svg(
      'text',
      { x: left, y: height - 6, class: 'kl-axis-label' },
      'P → · Q ↑ absorbed (lagging) · Q ↓ delivered (leading)',
    ),
  );
  const draw = (pt: TrianglePoint, cls: string, label: string) => {
    const x = X(pt.p),
      y = Y(pt.q);
    const c = cosPhi(pt);
    root.append(
      svg('polygon', { points: `${left},${y0} ${x},${y0} ${x},${y}`, class: `kl-tri ${cls}` }),
      svg('line', { x1: x, y1: y0, x2: x, y2: y, class: `kl-tri-q ${cls}` }),
      svg('line', { x1: left, y1: y0, x2: x, y2: y, class: `kl-tri-s ${cls}` }),
      svg('circle', { cx: x, cy: y, r: 3, class: `kl-tri-dot ${cls}` }),
      svg(
        'text',
        { x: x + 8, y: y + 4, class: `kl-tri-label ${cls}` },
        `${label}: ${formatNumber(pt.q, '0')} kvar${c === undefined ? '' : `, cos φ ${formatNumber(c, '0.000')}`}`,
      ),
    );
  };
  draw(t.before, 'is-before', 'before');
  if (t.after) draw(t.after, 'is-after', 'after');
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
      cos:
        c === undefined
          ? '—'
          : `${formatNumber(c, '0.000')} ${x.q > 0 ? 'lagging' : x.q < 0 ? 'leading' : ''}`.trim(),
    };
  };
  return [row('before', t.before), ...(t.after ? [row('after', t.after)] : [])];
}
