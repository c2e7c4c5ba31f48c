// Absorbed and delivered kvar per bus as horizontal bars either side of a zero line, with the
// net as a mark: one row per bus, so long bus names and many buses stay readable.
import { svg } from '../dom.ts';
import { formatNumber } from '../format/numberFormat.ts';
import { niceCeil, type BusBar } from './chartData.ts';

const ROW = 22,
  LABEL = 92,
  PAD = 10,
  VALUE = 58;

function label(bus: string, y: number): SVGTextElement {
  return svg(
    'text',
    { x: LABEL, y: y + 14, class: 'kl-bar-label', 'text-anchor': 'end' },
    bus.length > 14 ? `${bus.slice(0, 13)}…` : bus,
  );
}

/** A bus whose kvar the engine could not compute: a marked band with the error, no bar. */
function errorRow(b: BusBar, y: number, zero: number, width: number): SVGGElement {
  const g = svg('g', { class: 'kl-bar-row is-error', 'data-bus': b.bus });
  g.append(
    svg('title', {}, `${b.bus}: no kvar computed — ${b.error ?? ''}`),
    label(b.bus, y),
    svg('rect', {
      x: LABEL + PAD,
      y: y + 2,
      width: width - VALUE - LABEL - PAD,
      height: ROW - 6,
      class: 'kl-bar-error',
    }),
    svg(
      'text',
      { x: zero, y: y + 14, class: 'kl-bar-error-text', 'text-anchor': 'middle' },
      'error — see the Buses sheet',
    ),
    svg(
      'text',
      { x: width - 4, y: y + 14, class: 'kl-bar-value is-error', 'text-anchor': 'end' },
      (b.error ?? '#').split(' ')[0] as string,
    ),
  );
  return g;
}

export function busBarChart(bars: readonly BusBar[], width = 380): SVGSVGElement {
  const max = niceCeil(Math.max(1, ...bars.map((b) => Math.max(b.absorbed, b.delivered, Math.abs(b.net)))));
  const plotLeft = LABEL + PAD,
    plotRight = width - VALUE;
  const zero = (plotLeft + plotRight) / 2;
  const scale = (plotRight - plotLeft) / 2 / max;
  const height = PAD * 2 + 18 + bars.length * ROW;
  const root = svg('svg', {
    viewBox: `0 0 ${width} ${height}`,
    width,
    height,
    class: 'kl-chart kl-bars',
    role: 'img',
    'aria-label': 'Absorbed and delivered kvar per bus',
  });
  const top = PAD + 18;
  // Axis: zero line and the two ends.
  root.append(
    svg(
      'text',
      { x: plotLeft, y: PAD + 8, class: 'kl-axis-label', 'text-anchor': 'start' },
      `delivered ${formatNumber(max, '0')}`,
    ),
    svg(
      'text',
      { x: plotRight, y: PAD + 8, class: 'kl-axis-label', 'text-anchor': 'end' },
      `absorbed ${formatNumber(max, '0')} kvar`,
    ),
    svg('line', { x1: zero, x2: zero, y1: top - 4, y2: height - PAD, class: 'kl-axis' }),
  );
  bars.forEach((b, i) => {
    const y = top + i * ROW;
    if (b.error) {
      root.append(errorRow(b, y, zero, width));
      return;
    }
    const g = svg('g', { class: 'kl-bar-row' });
    const title = svg(
      'title',
      {},
      `${b.bus}: absorbed ${formatNumber(b.absorbed, '0.0')} kvar, delivered ${formatNumber(b.delivered, '0.0')} kvar, net ${formatNumber(b.net, '0.0')} kvar`,
    );
    g.append(
      title,
      label(b.bus, y),
      svg('rect', {
        x: zero,
        y: y + 3,
        width: Math.max(0, b.absorbed * scale),
        height: ROW - 8,
        class: 'kl-bar-absorbed',
      }),
      svg('rect', {
        x: zero - b.delivered * scale,
        y: y + 3,
        width: Math.max(0, b.delivered * scale),
        height: ROW - 8,
        class: 'kl-bar-delivered',
      }),
      svg('rect', { x: zero + b.net * scale - 1.5, y: y, width: 3, height: ROW - 2, class: 'kl-bar-net' }),
      svg(
        'text',
        { x: width - 4, y: y + 14, class: 'kl-bar-value', 'text-anchor': 'end' },
        formatNumber(b.net, '0'),
      ),
    );
    root.append(g);
  });
  return root;
}
