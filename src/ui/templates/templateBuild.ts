// A site file's text → its summary for the template list, or a live workbook. A template carries
// its banks (the design's proposal, kept current by a test); the design options of its Design
// options sheet are drafted by the design, loaded on demand here (the page loads it after opening
// anyway, for the detuning proposal); a site file without banks has them proposed on the way.
import { readSiteFile } from '../../core/site/siteFile.ts';
import { inputsFromSite } from '../../core/workbook/inputsFromSite.ts';
import { renderWorkbook } from '../../core/workbook/render.ts';
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

export async function workbookOf(id: string, text: string): Promise<WorkbookDoc> {
  const { site, problems, banks } = readSiteFile(text);
  const errors = problems.filter((p) => p.severity === 'error');
  if (errors.length > 0)
    throw new Error(`template "${id}" has problems: ${errors.slice(0, 3).map((p) => p.message).join('; ')}`);
  const chosen = banks ?? (await import('../../core/site/compensation.ts')).proposeChoices(site);
  // The Design options sheet starts with the standard options (their design loads now, on demand).
  const { draftOptions } = await import('../../core/site/designOptions.ts');
  return renderWorkbook(inputsFromSite(site, chosen, [], draftOptions(site)), { flavour: 'live' }).doc;
}
