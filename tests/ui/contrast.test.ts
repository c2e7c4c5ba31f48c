// WCAG 2.2 contrast ratio, checked against values the WCAG documents and common tools publish.
import { describe, expect, it } from 'vitest';
import { contrastRatio, over, parseColour } from '../../src/ui/format/contrast.ts';

const c = (t: string) => {
  const v = parseColour(t);
  if (!v) throw new Error(`not a colour: ${t}`);
  return v;
};

describe('contrast ratio', () => {
  it('black on white is 21:1 and a colour on itself 1:1 (WCAG 2.2, definition of contrast ratio)', () => {
    expect(contrastRatio(c('#000000'), c('#ffffff'))).toBeCloseTo(21, 10);
    expect(contrastRatio(c('rgb(93, 59, 140)'), c('#5d3b8c'))).toBeCloseTo(1, 10);
  });
  it('#777777 on white falls just short of 4.5:1 (4.48:1, the example every checker gives)', () => {
    expect(contrastRatio(c('#777777'), c('#ffffff'))).toBeCloseTo(4.48, 2);
    expect(contrastRatio(c('#767676'), c('#ffffff'))).toBeGreaterThanOrEqual(4.5);
  });
  it('reads the forms a browser reports, and paints a translucent colour over its ground', () => {
    expect(c('rgba(93, 59, 140, 0.1)')).toEqual({ r: 93, g: 59, b: 140, a: 0.1 });
    expect(c('rgb(10 20 30 / 50%)')).toEqual({ r: 10, g: 20, b: 30, a: 0.5 });
    expect(over(c('rgba(0, 0, 0, 0.5)'), c('#ffffff'))).toEqual({ r: 127.5, g: 127.5, b: 127.5, a: 1 });
    expect(parseColour('transparent')).toBeUndefined();
  });
});
