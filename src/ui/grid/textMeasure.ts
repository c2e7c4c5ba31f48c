// Width of a text in the grid's font, measured once per text on a canvas (no layout pass), so
// the renderer can tell whether a value fits its column.
const FONT_PX = 12.5;
let context: CanvasRenderingContext2D | null | undefined;
const cache = new Map<string, number>();

export function textWidth(text: string): number {
  const hit = cache.get(text);
  if (hit !== undefined) return hit;
  if (context === undefined) {
    context = document.createElement('canvas').getContext('2d');
    if (context) context.font = `${FONT_PX}px ${getComputedStyle(document.body).fontFamily || 'sans-serif'}`;
  }
  // Without a canvas: an average character of the grid's font.
  const w = context ? context.measureText(text).width : text.length * 6.8;
  if (cache.size > 5000) cache.clear();
  cache.set(text, w);
  return w;
}
