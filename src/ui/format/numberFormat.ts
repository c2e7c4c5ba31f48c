// Display of numbers by the column's format code (ColumnInfo.format). Only the small set of codes
// the workbook uses: '0', '0.0', '0.0##', '#,##0.0', '0.0%', '0.00E+00'; anything else is General.
// Display only: the engine keeps full precision and copies carry the full value.

interface Parsed {
  readonly decimals: number;
  /** With '#' after the zeros: up to this many decimals, trailing zeros beyond `decimals` dropped. */
  readonly maxDecimals: number;
  readonly grouping: boolean;
  readonly percent: boolean;
  readonly scientific: boolean;
}

const cache = new Map<string, Parsed | null>();

function parse(code: string): Parsed | null {
  const hit = cache.get(code);
  if (hit !== undefined) return hit;
  const m = /^(#,##)?0(?:\.(0*)(#*))?(%|E\+00)?$/.exec(code.trim());
  const parsed = m
    ? {
        grouping: m[1] !== undefined,
        decimals: m[2]?.length ?? 0,
        maxDecimals: (m[2]?.length ?? 0) + (m[3]?.length ?? 0),
        percent: m[4] === '%',
        scientific: m[4] === 'E+00',
      }
    : null;
  cache.set(code, parsed);
  return parsed;
}

function group(intPart: string): string {
  return intPart.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** General: up to 10 significant digits, no trailing zeros, exponent for very large or small. */
export function formatGeneral(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const ax = Math.abs(x);
  if (ax >= 1e11 || ax < 1e-6) return x.toExponential(4).replace(/\.?0+e/, 'e');
  return String(Number.parseFloat(x.toPrecision(10)));
}

export function formatNumber(x: number, code?: string): string {
  if (code === undefined || code === '' || code.toLowerCase() === 'general') return formatGeneral(x);
  const f = parse(code);
  if (!f) return formatGeneral(x);
  if (f.scientific) {
    const [mant, exp] = x.toExponential(f.decimals).split('e') as [string, string];
    const e = Number(exp);
    return `${mant}E${e < 0 ? '-' : '+'}${String(Math.abs(e)).padStart(2, '0')}`;
  }
  const v = f.percent ? x * 100 : x;
  let text = Math.abs(v).toFixed(f.maxDecimals);
  if (f.maxDecimals > f.decimals) {
    const cut = new RegExp(`0{1,${f.maxDecimals - f.decimals}}$`);
    text = text.replace(cut, '').replace(/\.$/, '');
  }
  if (f.grouping) {
    const [i, d] = text.split('.') as [string, string | undefined];
    text = d === undefined ? group(i) : `${group(i)}.${d}`;
  }
  // A value that rounds to zero shows without a minus sign.
  const negative = v < 0 && Number(text.replace(/,/g, '')) !== 0;
  return `${negative ? '-' : ''}${text}${f.percent ? '%' : ''}`;
}
