// The starter workbooks: the site files in templates/, bundled as raw text at build time (each
// in its own chunk) and built into live workbooks by the shared builder, which is fetched with
// the first template so a returning visit does not download it.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import type { TemplateInfo } from './templateBuild.ts';

export type { TemplateInfo } from './templateBuild.ts';

const files = import.meta.glob<string>('../../../templates/*.json', { query: '?raw', import: 'default' });

/** The template the first visit opens. */
export const DEMO_TEMPLATE = 'cold-store';

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
  const [{ infoOf }, t] = await Promise.all([import('./templateBuild.ts'), text(id)]);
  return infoOf(id, t);
}

/** A template as a live workbook; refuses a template with errors rather than showing half a site. */
export async function templateWorkbook(id: string): Promise<WorkbookDoc> {
  const [{ workbookOf }, t] = await Promise.all([import('./templateBuild.ts'), text(id)]);
  return workbookOf(id, t);
}
