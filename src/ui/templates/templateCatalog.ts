// The starter workbooks: the site files in templates/, bundled as raw text at build time (each
// in its own chunk, fetched when needed) and built into live workbooks by the shared builder.
import { readSiteFile } from '../../core/site/siteFile.ts';
import { buildWorkbook } from '../../core/workbook/build.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';

const files = import.meta.glob<string>('../../../templates/*.json', { query: '?raw', import: 'default' });

/** The template the first visit opens. */
export const DEMO_TEMPLATE = 'cold-store';

export interface TemplateInfo {
  readonly id: string;
  readonly title: string;
  readonly notes: readonly string[];
  readonly buses: number;
  readonly items: number;
  readonly cases: readonly string[];
}

export function templateIds(): string[] {
  return Object.keys(files)
    .map((p) => (/([^/]+)\.json$/.exec(p) as RegExpExecArray)[1] as string)
    .sort();
}

async function text(id: string): Promise<string> {
  const load = Object.entries(files).find(([p]) => p.endsWith(`/${id}.json`))?.[1];
  if (!load) throw new Error(`no template called "${id}"`);
  return load();
}

export async function templateInfo(id: string): Promise<TemplateInfo> {
  const { site } = readSiteFile(await text(id));
  return {
    id,
    title: site.settings.name,
    notes: site.settings.notes ?? [],
    buses: new Set(site.equipment.flatMap((r) => [r.bus, ...(r.to_bus ? [r.to_bus] : [])])).size,
    items: site.equipment.length,
    cases: site.settings.cases,
  };
}

/** A template as a live workbook; refuses a template with errors rather than showing half a site. */
export async function templateWorkbook(id: string): Promise<WorkbookDoc> {
  const { site, problems } = readSiteFile(await text(id));
  const errors = problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) throw new Error(`template "${id}" has problems: ${errors.slice(0, 3).map((p) => p.message).join('; ')}`);
  return buildWorkbook(site, { flavour: 'live' });
}
