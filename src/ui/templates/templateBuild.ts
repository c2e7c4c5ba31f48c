// A site file's text → its summary for the template list, or a live workbook.
import { readSiteFile } from '../../core/site/siteFile.ts';
import { buildWorkbook } from '../../core/workbook/build.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';

export interface TemplateInfo {
  readonly id: string;
  readonly title: string;
  readonly notes: readonly string[];
  readonly buses: number;
  readonly items: number;
  readonly cases: readonly string[];
}

export function infoOf(id: string, text: string): TemplateInfo {
  const { site } = readSiteFile(text);
  return {
    id,
    title: site.settings.name,
    notes: site.settings.notes ?? [],
    buses: new Set(site.equipment.flatMap((r) => [r.bus, ...(r.to_bus ? [r.to_bus] : [])])).size,
    items: site.equipment.length,
    cases: site.settings.cases,
  };
}

export function workbookOf(id: string, text: string): WorkbookDoc {
  const { site, problems } = readSiteFile(text);
  const errors = problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) throw new Error(`template "${id}" has problems: ${errors.slice(0, 3).map((p) => p.message).join('; ')}`);
  return buildWorkbook(site, { flavour: 'live' });
}
