// Measures what the page downloads, gzip-compressed (node:zlib, level 9), from a Vite build's
// manifest: the initial JavaScript (the entry and its static imports, which the page preloads),
// what a first visit adds to open the demo (the template and the workbook builder), and whether
// the xlsx library stays out of both. Run directly for the figures:
//   npx tsx tests/browser/bundleSize.ts        (builds into a temporary folder)
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import { build } from 'vite';

export const ROOT = resolve(import.meta.dirname, '../..');
/** The page's budget (README, download size): initial JavaScript and the first visit's extra at most 437 kB gzip (kB = 1000 bytes, as Vite prints). */
export const INITIAL_JS_BUDGET = 437_000;

interface ManifestChunk {
  readonly file: string;
  readonly src?: string;
  readonly isEntry?: boolean;
  readonly imports?: readonly string[];
  readonly dynamicImports?: readonly string[];
  readonly css?: readonly string[];
}
type Manifest = Record<string, ManifestChunk>;

export interface BundleReport {
  /** Entry plus static imports: what every visit loads before the page works. */
  readonly initial: { readonly files: string[]; readonly gzip: number; readonly raw: number };
  /** What the first visit adds to build the demo workbook. */
  readonly firstVisitExtra: { readonly files: string[]; readonly gzip: number };
  readonly css: { readonly files: string[]; readonly gzip: number };
  /** Chunks holding the xlsx library, and whether any is in the initial or first-visit sets. */
  readonly xlsx: {
    readonly files: string[];
    readonly inInitial: boolean;
    readonly inFirstVisit: boolean;
    readonly gzip: number;
  };
}

function closure(m: Manifest, keys: readonly string[]): Set<string> {
  const seen = new Set<string>();
  const walk = (k: string) => {
    if (seen.has(k) || !m[k]) return;
    seen.add(k);
    for (const i of m[k].imports ?? []) walk(i);
  };
  keys.forEach(walk);
  return seen;
}

export async function measure(outDir: string): Promise<BundleReport> {
  const m = JSON.parse(await readFile(join(outDir, '.vite', 'manifest.json'), 'utf8')) as Manifest;
  const size = async (file: string) => {
    const bytes = await readFile(join(outDir, file));
    return { raw: bytes.length, gzip: gzipSync(bytes, { level: 9 }).length };
  };
  const entryKey = Object.keys(m).find((k) => m[k]?.isEntry);
  if (!entryKey) throw new Error('no entry in the build manifest');
  const initialKeys = closure(m, [entryKey]);
  const demoKeys = Object.keys(m).filter(
    (k) => /templates\/templateBuild\.ts$/.test(k) || /templates\/cold-store\.json/.test(k),
  );
  const firstKeys = [...closure(m, demoKeys)].filter((k) => !initialKeys.has(k));
  const files = (keys: Iterable<string>) => [...keys].map((k) => (m[k] as ManifestChunk).file);
  let gz = 0,
    raw = 0;
  for (const f of files(initialKeys)) {
    const s = await size(f);
    gz += s.gzip;
    raw += s.raw;
  }
  let extra = 0;
  for (const f of files(firstKeys)) extra += (await size(f)).gzip;
  const cssFiles = [...new Set([...initialKeys].flatMap((k) => m[k]?.css ?? []))];
  let css = 0;
  for (const f of cssFiles) css += (await size(f)).gzip;
  const xlsxKeys = Object.keys(m).filter((k) => /exceljs/.test(k) || /exceljs/.test(m[k]?.file ?? ''));
  let xg = 0;
  for (const f of files(xlsxKeys)) xg += (await size(f)).gzip;
  return {
    initial: { files: files(initialKeys), gzip: gz, raw },
    firstVisitExtra: { files: files(firstKeys), gzip: extra },
    css: { files: cssFiles, gzip: css },
    xlsx: {
      files: files(xlsxKeys),
      inInitial: xlsxKeys.some((k) => initialKeys.has(k)),
      inFirstVisit: xlsxKeys.some((k) => firstKeys.includes(k)),
      gzip: xg,
    },
  };
}

/** Build the app with a manifest into a fresh temporary folder and measure it. */
export async function buildAndMeasure(): Promise<BundleReport> {
  const outDir = await mkdtemp(join(tmpdir(), 'kl-bundle-'));
  try {
    await build({
      root: ROOT,
      logLevel: 'error',
      configFile: join(ROOT, 'vite.config.ts'),
      build: { outDir, emptyOutDir: true, manifest: true },
    });
    return await measure(outDir);
  } finally {
    await rm(outDir, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const r = await buildAndMeasure();
  const kb = (n: number) => `${(n / 1000).toFixed(1)} kB`;
  console.log(
    `initial JavaScript: ${kb(r.initial.gzip)} gzip (${kb(r.initial.raw)} raw) in ${r.initial.files.length} file(s); budget ${kb(INITIAL_JS_BUDGET)}`,
  );
  console.log(
    `first visit adds (demo template and builder): ${kb(r.firstVisitExtra.gzip)} gzip → ${kb(r.initial.gzip + r.firstVisitExtra.gzip)}`,
  );
  console.log(
    `CSS: ${kb(r.css.gzip)} gzip; xlsx library: ${kb(r.xlsx.gzip)} gzip, loaded on demand only: ${!r.xlsx.inInitial && !r.xlsx.inFirstVisit}`,
  );
}
