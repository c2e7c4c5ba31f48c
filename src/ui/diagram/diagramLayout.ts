// Where each bus of the diagram goes. Voltage levels are horizontal bands, highest voltage on
// top; inside a band a bus fed from the same voltage (a line) sits one tier lower than its
// feeder. Left to right the trees are laid out leaf by leaf: a bus stands over its first child,
// its bar reaches its last child, so every feeder drops straight down. Large sites stay
// readable by collapsing the deepest visible level once more than `maxShown` buses would show;
// a collapsed bus counts what it hides and how many of those are in error.
import type { DiagramBus, DiagramModel } from './diagramModel.ts';

export const GEOMETRY = {
  /** Width of one bus's slot: its label box, the gap to its feeder, and a margin. */
  slot: 184,
  /** The label box sits above the bar, left of the feeder, `gap` away from it. */
  box: { w: 150, h: 76, gap: 14 },
  /** From one tier's bus bar to the next tier's bus bar. */
  tier: 164,
  /** From the top of a tier to its bar: room for the feeder symbol and the label box. */
  barDrop: 128,
  /** Left margin for the band labels. */
  left: 64,
  top: 16,
  /** Right of the last feeder: room for the transformer's label. */
  tail: 150,
} as const;

export const MAX_SHOWN = 60;

export interface PlacedBus {
  readonly bus: DiagramBus;
  /** Where the feeder meets the bar. */
  readonly x: number;
  /** The bar's height on the page. */
  readonly y: number;
  readonly barLeft: number;
  readonly barRight: number;
  /** Buses hidden below this one (collapsed), and how many of those are in error. */
  readonly hidden: number;
  readonly hiddenErrors: number;
  readonly collapsed: boolean;
}

export interface Band {
  readonly label: string;
  readonly kv?: number;
  readonly top: number;
  readonly bottom: number;
}

export interface DiagramLayout {
  readonly buses: readonly PlacedBus[];
  readonly bands: readonly Band[];
  readonly width: number;
  readonly height: number;
  /** Buses in the workbook and buses drawn (the rest are inside collapsed buses). */
  readonly total: number;
  readonly shown: number;
}

/** Buses collapsed by default: those at the deepest level that keeps at most `maxShown` buses. */
export function defaultCollapsed(model: DiagramModel, maxShown = MAX_SHOWN): Set<string> {
  const perDepth: number[] = [];
  for (const b of model.buses.values()) perDepth[b.depth] = (perDepth[b.depth] ?? 0) + 1;
  let shown = 0,
    limit = perDepth.length - 1;
  for (let d = 0; d < perDepth.length; d++) {
    shown += perDepth[d] ?? 0;
    if (shown > maxShown) {
      limit = Math.max(1, d - 1);
      break;
    }
  }
  const out = new Set<string>();
  for (const b of model.buses.values()) if (b.depth === limit && b.children.length > 0) out.add(b.name);
  return out;
}

function bandKey(kv: number | undefined): string {
  return kv === undefined ? 'unknown' : String(kv);
}

export function layoutDiagram(model: DiagramModel, collapsed: ReadonlySet<string>): DiagramLayout {
  const G = GEOMETRY;
  const visible: DiagramBus[] = [];
  const hiddenCount = new Map<string, { n: number; errors: number }>();
  const countBelow = (name: string): { n: number; errors: number } => {
    let n = 0,
      errors = 0;
    const stack = [...(model.buses.get(name)?.children ?? [])];
    while (stack.length) {
      const b = model.buses.get(stack.pop() as string);
      if (!b) continue;
      n++;
      if (b.errors.length > 0) errors++;
      stack.push(...b.children);
    }
    return { n, errors };
  };
  const visit = (name: string) => {
    const b = model.buses.get(name);
    if (!b) return;
    visible.push(b);
    if (collapsed.has(name) && b.children.length > 0) hiddenCount.set(name, countBelow(name));
    else for (const c of b.children) visit(c);
  };
  for (const r of model.roots) visit(r);

  // Bands: one per voltage, highest first. A bus whose voltage is not stated stays in its
  // feeder's band; a point of connection without one gets a band of its own on top.
  const keyOf = new Map<string, string>();
  for (const b of visible) {
    const parentKey = b.parent === undefined ? undefined : keyOf.get(b.parent);
    keyOf.set(b.name, b.kv !== undefined ? bandKey(b.kv) : (parentKey ?? 'unknown'));
  }
  const kvs = [...new Set(keyOf.values())].sort((a, b) =>
    a === 'unknown' ? -1 : b === 'unknown' ? 1 : Number(b) - Number(a),
  );
  // Tier inside a band: 0, or one more than a feeder in the same band.
  const inBand = new Map<string, number>();
  const tiersOf = new Map<string, number>(kvs.map((k) => [k, 1]));
  for (const b of visible) {
    const k = keyOf.get(b.name) as string;
    const same = b.parent !== undefined && keyOf.get(b.parent) === k;
    const t = same ? (inBand.get(b.parent as string) ?? 0) + 1 : 0;
    inBand.set(b.name, t);
    tiersOf.set(k, Math.max(tiersOf.get(k) ?? 1, t + 1));
  }
  const bands: Band[] = [];
  const bandTop = new Map<string, number>();
  let y = G.top;
  for (const k of kvs) {
    const h = (tiersOf.get(k) ?? 1) * G.tier;
    bandTop.set(k, y);
    bands.push({
      label: k === 'unknown' ? 'U not stated' : `${k} kV`,
      ...(k === 'unknown' ? {} : { kv: Number(k) }),
      top: y,
      bottom: y + h,
    });
    y += h;
  }
  // A bar sits low in its tier: the label box above it, its feeder's symbol above that.
  const barY = (b: DiagramBus) =>
    (bandTop.get(keyOf.get(b.name) as string) ?? 0) + (inBand.get(b.name) ?? 0) * G.tier + G.barDrop;

  // Left to right, leaf by leaf.
  const x = new Map<string, number>();
  const right = new Map<string, number>();
  let next = 0;
  const place = (name: string) => {
    const b = model.buses.get(name) as DiagramBus;
    const kids = hiddenCount.has(name) ? [] : b.children.filter((c) => model.buses.has(c));
    if (kids.length === 0) {
      x.set(name, G.left + next * G.slot + G.box.w + G.box.gap);
      next++;
    } else {
      for (const c of kids) place(c);
      x.set(name, x.get(kids[0] as string) as number);
    }
    right.set(name, Math.max(...[name, ...kids].map((n) => x.get(n) as number)));
  };
  for (const r of model.roots) if (model.buses.has(r)) place(r);

  const placed: PlacedBus[] = visible.map((b) => {
    const bx = x.get(b.name) as number;
    const hidden = hiddenCount.get(b.name);
    return {
      bus: b,
      x: bx,
      y: barY(b),
      // Short of the slot's edges, so two buses side by side never read as one bar.
      barLeft: bx - G.box.w - G.box.gap + 8,
      barRight: (right.get(b.name) as number) + 14,
      hidden: hidden?.n ?? 0,
      hiddenErrors: hidden?.errors ?? 0,
      collapsed: hidden !== undefined,
    };
  });
  return {
    buses: placed,
    bands,
    width: G.left + Math.max(1, next) * G.slot + G.tail - G.slot + G.box.w + G.box.gap,
    height: y + 16,
    total: model.buses.size,
    shown: visible.length,
  };
}
