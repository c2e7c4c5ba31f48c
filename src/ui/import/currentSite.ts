// The open workbook's site as the import sees it: its settings (name, cases, requirement) and
// its equipment, read back from the sheets by the shared reader.
import type { Site, SiteSettings } from '../../core/site/model.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { siteFromWorkbook } from '../../core/workbook/readSite.ts';

export function currentSite(doc: WorkbookDoc): Site | undefined {
  try {
    return siteFromWorkbook(doc).site;
  } catch {
    return undefined;
  }
}

export function currentSettings(doc: WorkbookDoc): SiteSettings | undefined {
  return currentSite(doc)?.settings;
}
