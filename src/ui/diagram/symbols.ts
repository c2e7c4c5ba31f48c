// Trade symbols of IEC 60617, drawn in our plain line style where the diagram needs one: the
// two-winding transformer (two overlapping circles, IEC 60617 S00841), the capacitor (two
// plates, S00567), the inductor / reactor (a row of arcs, S00583) and earth (S00200). Each
// function draws at a point on a vertical connection and returns one group.
import { svg } from '../dom.ts';

/** Two-winding transformer centred at (x, y), windings one above the other. */
export function transformerSymbol(x: number, y: number): SVGGElement {
  const g = svg('g', { class: 'kl-dg-sym kl-dg-xfmr' });
  g.append(svg('circle', { cx: x, cy: y - 6.5, r: 10 }), svg('circle', { cx: x, cy: y + 6.5, r: 10 }));
  return g;
}

/** Earth under a shunt element at (x, y). */
function earth(x: number, y: number): SVGPathElement {
  return svg('path', {
    d: `M${x - 7} ${y}H${x + 7}M${x - 4.5} ${y + 3}H${x + 4.5}M${x - 2} ${y + 6}H${x + 2}`,
  });
}

/** Three arcs of an inductor, continuing a path downwards by 18. */
const COIL = 'a3 3 0 0 1 0 6a3 3 0 0 1 0 6a3 3 0 0 1 0 6';

/**
 * A capacitor bank hanging from a bar at (x, y): lead, plates, earth. With `detuned`, the
 * detuning reactor in series above the plates.
 */
export function capacitorSymbol(x: number, y: number, detuned: boolean): SVGGElement {
  const g = svg('g', { class: 'kl-dg-sym kl-dg-cap' });
  const top = detuned ? y + 24 : y + 12;
  g.append(
    svg('path', {
      d: detuned ? `M${x} ${y}V${y + 4}${COIL}V${top}` : `M${x} ${y}V${top}`,
    }),
    svg('path', { d: `M${x - 8} ${top}H${x + 8}M${x - 8} ${top + 5}H${x + 8}`, class: 'kl-dg-plates' }),
    svg('path', { d: `M${x} ${top + 5}V${top + 12}` }),
    earth(x, top + 12),
  );
  return g;
}

/** A shunt reactor hanging from a bar at (x, y): lead, coil, earth. */
export function reactorSymbol(x: number, y: number): SVGGElement {
  const g = svg('g', { class: 'kl-dg-sym kl-dg-reactor' });
  g.append(svg('path', { d: `M${x} ${y}V${y + 6}${COIL}V${y + 30}` }), earth(x, y + 30));
  return g;
}

/** The supply at a point of connection: a feeder from above ending in an arrowhead on the bar. */
export function supplySymbol(x: number, y: number, top: number): SVGGElement {
  const g = svg('g', { class: 'kl-dg-sym kl-dg-supply' });
  g.append(
    svg('path', { d: `M${x} ${top}V${y}` }),
    svg('path', { d: `M${x - 5} ${y - 9}L${x} ${y - 1}L${x + 5} ${y - 9}`, class: 'kl-dg-arrow' }),
  );
  return g;
}
