// The diagram as SVG: bands for the voltage levels, a bar and a label box per bus, feeders with
// their symbols, compensation hanging from the bars. Text goes in as text nodes; every style
// is a class (styles/diagram.css), so the page needs no inline style and the exported file
// carries the same rules.
import { svg } from '../dom.ts';
import { formatNumber } from '../format/numberFormat.ts';
import { GEOMETRY as G, type DiagramLayout, type PlacedBus } from './diagramLayout.ts';
import type { DiagramBus } from './diagramModel.ts';
import { capacitorSymbol, reactorSymbol, supplySymbol, transformerSymbol } from './symbols.ts';

const kw = (x: number) => formatNumber(x, '#,##0.0');

export function figureLines(b: DiagramBus): string[] {
  const f = b.figures;
  if (b.sheetRow === undefined) return ['no totals yet:', 'not on the Buses sheet', ''];
  // An error is shown as its code, never as a blank or a zero.
  const shown = (k: 'p' | 'q', x: number | undefined, unit: string) =>
    f.failed?.[k] ?? (x === undefined ? '—' : `${kw(x)} ${unit}`);
  const sense = f.q !== undefined && f.q !== 0 ? (f.q > 0 ? ' lagging' : ' leading') : '';
  const cos = f.failed?.cos ?? (f.cos === undefined ? '—' : `${formatNumber(f.cos, '0.000')}${sense}`);
  return [`P ${shown('p', f.p, 'kW')}`, `Q ${shown('q', f.q, 'kvar')}`, `cos φ ${cos}`];
}

export function busTitle(b: DiagramBus): string {
  const lines = [`${b.name}${b.kv !== undefined ? `, ${b.kv} kV` : ''}`, ...figureLines(b).filter(Boolean)];
  if (b.itemsText) lines.push(b.itemsText);
  for (const e of b.errors) lines.push(`error: ${e}`);
  lines.push(b.sheetRow === undefined ? '' : 'Click to show this bus on the Buses sheet.');
  return lines.filter(Boolean).join('\n');
}

function clip(text: string, max: number): string {
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

function feederLabel(b: DiagramBus): string[] {
  const f = b.feeder;
  if (!f) return [];
  if (f.kind === 'line') return [clip(f.tag, 22), 'line'];
  if (f.kind === 'feeder') return [clip(f.tag, 22), 'feeder cable'];
  const rating = f.sKva === undefined ? '' : `${formatNumber(f.sKva, '#,##0')} kVA`;
  return [clip(f.tag, 22), [f.units > 1 ? `${f.units} ×` : '', rating].filter(Boolean).join(' ')];
}

function busGroup(p: PlacedBus, parentY: number | undefined): SVGGElement {
  const b = p.bus;
  const err = b.errors.length > 0;
  const g = svg('g', {
    class: `kl-dg-bus${err ? ' is-error' : ''}${b.sheetRow === undefined ? ' is-off-sheet' : ''}`,
    'data-bus': b.name,
    tabindex: 0,
    role: 'button',
    'aria-label': busTitle(b).replace(/\n/g, '; '),
  });
  g.append(svg('title', {}, busTitle(b)));
  // The feeder from the bus above (or the supply), with its symbol and label.
  if (parentY !== undefined && b.feeder) {
    g.append(svg('path', { d: `M${p.x} ${parentY}V${p.y}`, class: 'kl-dg-wire' }));
    // At the top of the bus's own tier: where the voltage changes, for a transformer.
    const mid = p.y - G.barDrop + 30;
    if (b.feeder.kind === 'transformer') g.append(transformerSymbol(p.x, mid));
    feederLabel(b).forEach((t, i) =>
      g.append(svg('text', { x: p.x + 16, y: mid - 3 + i * 13, class: 'kl-dg-feeder-label' }, t)),
    );
  } else if (b.depth === 0) {
    g.append(supplySymbol(p.x, p.y, p.y - G.barDrop + 14));
    g.append(svg('text', { x: p.x + 10, y: p.y - G.barDrop + 26, class: 'kl-dg-feeder-label' }, 'supply'));
  }
  // Label box above the bar, left of the feeder.
  const bx = p.x - G.box.gap - G.box.w,
    by = p.y - 4 - G.box.h;
  g.append(svg('rect', { x: bx, y: by, width: G.box.w, height: G.box.h, rx: 3, class: 'kl-dg-box' }));
  const lines: Array<[string, string]> = [
    [clip(b.name, 16), 'kl-dg-name'],
    ...figureLines(b).map((t): [string, string] => [t, 'kl-dg-fig']),
    [clip(b.itemsText, 28), 'kl-dg-items'],
  ];
  lines.forEach(([t, cls], i) => {
    if (t) g.append(svg('text', { x: bx + 7, y: by + 14 + i * 14, class: cls }, t));
  });
  g.append(
    svg(
      'text',
      { x: bx + G.box.w - (err ? 22 : 7), y: by + 14, class: 'kl-dg-kv', 'text-anchor': 'end' },
      b.kv === undefined ? 'U ?' : `${b.kv} kV`,
    ),
  );
  if (err) {
    g.append(
      svg('circle', { cx: bx + G.box.w - 10, cy: by + 11, r: 7, class: 'kl-dg-err-dot' }),
      svg(
        'text',
        { x: bx + G.box.w - 10, y: by + 15, class: 'kl-dg-err-mark', 'text-anchor': 'middle' },
        '!',
      ),
    );
  }
  g.append(svg('path', { d: `M${p.barLeft} ${p.y}H${p.barRight}`, class: 'kl-dg-bar' }));
  // Compensation under the bar, left of the feeder.
  let cx = bx + 12;
  if (b.capacitors) {
    g.append(capacitorSymbol(cx, p.y, b.capacitors.detuned));
    g.append(
      svg(
        'text',
        { x: cx + 12, y: p.y + 20, class: 'kl-dg-comp-label' },
        `${formatNumber(b.capacitors.kvar, '#,##0')} kvar`,
      ),
    );
    cx += 70;
  }
  if (b.reactors) {
    g.append(reactorSymbol(cx, p.y));
    g.append(
      svg(
        'text',
        { x: cx + 10, y: p.y + 20, class: 'kl-dg-comp-label' },
        `${formatNumber(b.reactors.kvar, '#,##0')} kvar`,
      ),
    );
  }
  return g;
}

function collapsedBadge(p: PlacedBus): SVGGElement {
  const text = `+${p.hidden} bus${p.hidden === 1 ? '' : 'es'} below${p.hiddenErrors ? `, ${p.hiddenErrors} in error` : ''}`;
  const w = text.length * 6.2 + 14;
  const g = svg('g', {
    class: `kl-dg-more${p.hiddenErrors ? ' is-error' : ''}`,
    'data-expand': p.bus.name,
    tabindex: 0,
    role: 'button',
    'aria-label': `Show the ${p.hidden} buses below ${p.bus.name}`,
  });
  g.append(
    svg('title', {}, `Show the buses below ${p.bus.name}`),
    svg('path', { d: `M${p.x} ${p.y}V${p.y + 14}`, class: 'kl-dg-wire' }),
    svg('rect', { x: p.x - 8, y: p.y + 14, width: w, height: 18, rx: 9, class: 'kl-dg-more-box' }),
    svg('text', { x: p.x - 1, y: p.y + 27, class: 'kl-dg-more-text' }, text),
  );
  return g;
}

export function diagramSvg(layout: DiagramLayout, caption: string, scale = 1): SVGSVGElement {
  const root = svg('svg', {
    xmlns: 'http://www.w3.org/2000/svg',
    viewBox: `0 0 ${layout.width} ${layout.height}`,
    width: Math.round(layout.width * scale),
    height: Math.round(layout.height * scale),
    class: 'kl-dg',
    role: 'group',
    'aria-label': caption,
  });
  root.append(svg('title', {}, caption));
  layout.bands.forEach((band, i) => {
    root.append(
      svg('rect', {
        x: 0,
        y: band.top,
        width: layout.width,
        height: band.bottom - band.top,
        class: `kl-dg-band${i % 2 ? ' is-alt' : ''}`,
      }),
      svg('text', { x: 8, y: band.top + 18, class: 'kl-dg-band-label' }, band.label),
    );
  });
  const yOf = new Map(layout.buses.map((p) => [p.bus.name, p.y]));
  for (const p of layout.buses) {
    root.append(busGroup(p, p.bus.parent === undefined ? undefined : yOf.get(p.bus.parent)));
    if (p.collapsed) root.append(collapsedBadge(p));
  }
  return root;
}
