// The open workbook's site as the import sees it: settings (name, cases, requirement), equipment
// and the banks chosen, read back from the sheets by the shared reader.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { siteFromWorkbook, type SiteFromWorkbook } from '../../core/workbook/readSite.ts';

export function currentSite(doc: WorkbookDoc): SiteFromWorkbook | undefined {
  try {
    return siteFromWorkbook(doc);
  } catch {
    return undefined;
  }
}
