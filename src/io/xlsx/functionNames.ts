// Which function names another spreadsheet program knows, and how they are stored in an xlsx.
// Classic functions (those of the 2007 file format, ECMA-376 1st edition, Part 4 §3.17.7) are
// stored as written. Later additions must be stored with the `_xlfn.` prefix (ECMA-376 Part 1,
// 18.17.7 "future functions"), or a reader shows an unknown-name error. Anything else (the
// engine's own extras, our catalogue before expansion, the fast bus roll-up) is unknown to
// other programs and must not be exported.
import { tokenize } from '../formula/index.ts';

/** Classic functions the formula engine also has. */
export const CLASSIC_FUNCTIONS: ReadonlySet<string> = new Set(
  `ABS ACOS ACOSH ADDRESS AND ASIN ASINH ATAN ATAN2 ATANH AVEDEV AVERAGE AVERAGEA AVERAGEIF BESSELI BESSELJ
  BESSELK BESSELY BETADIST BETAINV BIN2DEC BIN2HEX BIN2OCT BINOMDIST CEILING CHAR CHIDIST CHIINV CHITEST CHOOSE
  CLEAN CODE COLUMN COLUMNS COMBIN COMPLEX CONCATENATE CONFIDENCE CORREL COS COSH COUNT COUNTA COUNTBLANK COUNTIF
  COUNTIFS COVAR CRITBINOM CUMIPMT CUMPRINC DATE DATEDIF DATEVALUE DAVERAGE DAY DAYS360 DB DCOUNT DCOUNTA DDB
  DEC2BIN DEC2HEX DEC2OCT DEGREES DELTA DEVSQ DGET DMAX DMIN DOLLARDE DOLLARFR DPRODUCT DSTDEV DSTDEVP DSUM DVAR
  DVARP EDATE EFFECT EOMONTH ERF ERFC EVEN EXACT EXP EXPONDIST FACT FACTDOUBLE FALSE FDIST FIND FINV FISHER
  FISHERINV FLOOR FTEST FV FVSCHEDULE GAMMADIST GAMMAINV GAMMALN GCD GEOMEAN HARMEAN HEX2BIN HEX2DEC HEX2OCT
  HLOOKUP HOUR HYPERLINK HYPGEOMDIST IF IFERROR IMABS IMAGINARY IMARGUMENT IMCONJUGATE IMCOS IMDIV IMEXP IMLN
  IMLOG10 IMLOG2 IMPOWER IMPRODUCT IMREAL IMSIN IMSQRT IMSUB IMSUM INDEX INT IPMT IRR ISBLANK ISERR ISERROR ISEVEN
  ISLOGICAL ISNA ISNONTEXT ISNUMBER ISODD ISPMT ISREF ISTEXT LARGE LCM LEFT LEN LN LOG LOG10 LOGINV LOGNORMDIST
  LOWER MATCH MAX MAXA MEDIAN MID MIN MINA MINUTE MIRR MMULT MOD MONTH MROUND MULTINOMIAL N NA NEGBINOMDIST
  NETWORKDAYS NOMINAL NORMDIST NORMINV NORMSDIST NORMSINV NOT NOW NPER NPV OCT2BIN OCT2DEC OCT2HEX ODD OFFSET OR
  PEARSON PERCENTILE PI PMT POISSON POWER PPMT PRODUCT PROPER PV QUARTILE QUOTIENT RADIANS RAND RANDBETWEEN RATE
  REPLACE REPT RIGHT ROMAN ROUND ROUNDDOWN ROUNDUP ROW ROWS RSQ SEARCH SECOND SERIESSUM SIGN SIN SINH SKEW SLN
  SLOPE SMALL SQRT SQRTPI STANDARDIZE STDEV STDEVA STDEVP STDEVPA STEYX SUBSTITUTE SUBTOTAL SUM SUMIF SUMIFS
  SUMPRODUCT SUMSQ SUMX2MY2 SUMX2PY2 SUMXMY2 SYD T TAN TANH TBILLEQ TBILLPRICE TBILLYIELD TDIST TEXT TIME
  TIMEVALUE TINV TODAY TRANSPOSE TRIM TRUE TRUNC TTEST UPPER VALUE VAR VARA VARP VARPA VLOOKUP WEEKDAY WEEKNUM
  WEIBULL WORKDAY XIRR XNPV YEAR YEARFRAC ZTEST`.split(/\s+/),
);

/** Later functions the engine has, with the prefix they are stored under. */
export const NEWER_FUNCTIONS: ReadonlyMap<string, string> = new Map([
  ...`ACOT ACOTH ARABIC BASE BETA.DIST BETA.INV BINOM.DIST BINOM.INV BITAND BITLSHIFT BITOR BITRSHIFT BITXOR
  CEILING.MATH CEILING.PRECISE CHISQ.DIST CHISQ.DIST.RT CHISQ.INV CHISQ.INV.RT CHISQ.TEST COMBINA CONFIDENCE.NORM
  CONFIDENCE.T COT COTH COVARIANCE.P COVARIANCE.S CSC CSCH DAYS DECIMAL EXPON.DIST F.DIST F.DIST.RT F.INV F.INV.RT
  F.TEST FLOOR.MATH FLOOR.PRECISE FORMULATEXT GAMMA GAMMA.DIST GAMMA.INV GAMMALN.PRECISE GAUSS HYPGEOM.DIST IFNA
  IFS IMCOSH IMCOT IMCSC IMCSCH IMSEC IMSECH IMSINH IMTAN ISFORMULA ISO.CEILING ISOWEEKNUM LOGNORM.DIST
  LOGNORM.INV MAXIFS MINIFS NEGBINOM.DIST NETWORKDAYS.INTL NORM.DIST NORM.INV NORM.S.DIST NORM.S.INV PDURATION
  PERCENTILE.EXC PERCENTILE.INC PHI POISSON.DIST QUARTILE.EXC QUARTILE.INC RRI SEC SECH SHEET SHEETS SKEW.P
  STDEV.P STDEV.S SWITCH T.DIST T.DIST.2T T.DIST.RT T.INV T.INV.2T T.TEST TEXTJOIN UNICHAR UNICODE VAR.P VAR.S
  WEIBULL.DIST WORKDAY.INTL XLOOKUP XOR Z.TEST SEQUENCE UNIQUE VSTACK HSTACK`
    .split(/\s+/)
    .map((n) => [n, '_xlfn.'] as const),
  ['FILTER', '_xlfn._xlws.'],
  ['SORT', '_xlfn._xlws.'],
]);

const FILE_PREFIX = /^(?:_xlfn\.)?(?:_xlws\.)?/i;

export type FunctionClass = 'classic' | 'newer' | 'unknown';

export function classifyFunction(name: string): FunctionClass {
  const n = name.toUpperCase();
  if (CLASSIC_FUNCTIONS.has(n)) return 'classic';
  if (NEWER_FUNCTIONS.has(n)) return 'newer';
  return 'unknown';
}

export interface FileFormula {
  /** Formula text as stored in the xlsx (no leading '='). */
  readonly text: string;
  readonly newer: readonly string[];
  readonly unknown: readonly string[];
}

/** A formula with each text literal emptied ("abc" → ""), for scans that must not look inside text. */
export function withoutText(formula: string): string {
  return formula.includes('"') ? formula.replace(/"(?:[^"]|"")*"?/g, '""') : formula;
}

/** Names directly followed by '(' in a formula without string literals. */
const CALLED = /([A-Za-z_][A-Za-z0-9_.]*)\(/g;

/** A plain formula (with or without '=') as it must be stored in an xlsx. */
export function toFileFormula(formula: string): FileFormula {
  const body = formula.trimStart().startsWith('=') ? formula.trimStart().slice(1) : formula;
  // Fast path for the usual case, only classic calls, so nothing changes (text literals cannot call).
  if (
    [...withoutText(body).matchAll(CALLED)].every((m) =>
      CLASSIC_FUNCTIONS.has((m[1] as string).toUpperCase()),
    )
  ) {
    return { text: body, newer: [], unknown: [] };
  }
  const newer = new Set<string>();
  const unknown = new Set<string>();
  const text = tokenize(body)
    .map((t) => {
      if (t.kind !== 'func') return t.text;
      const name = t.text.toUpperCase();
      const cls = classifyFunction(name);
      if (cls === 'newer') {
        newer.add(name);
        return (NEWER_FUNCTIONS.get(name) as string) + name;
      }
      if (cls === 'unknown') unknown.add(name);
      return t.text;
    })
    .join('');
  return { text, newer: [...newer], unknown: [...unknown] };
}

/** A formula read from an xlsx, as the engine takes it: '=' and no storage prefixes. */
export function fromFileFormula(text: string): string {
  if (!/_xl/i.test(text)) return '=' + text;
  const body = tokenize(text)
    .map((t) => (t.kind === 'func' || t.kind === 'name' ? t.text.replace(FILE_PREFIX, '') : t.text))
    .join('');
  return '=' + body;
}
