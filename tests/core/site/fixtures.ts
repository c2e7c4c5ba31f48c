// Small helpers for site tests: a site from CSV text, with settings a test may override.
import { readCsv } from '../../../src/io/csv/read.ts';
import { parseEquipmentTable } from '../../../src/core/site/parse.ts';
import type { Site, SiteSettings } from '../../../src/core/site/model.ts';
import type { Problem } from '../../../src/core/site/problems.ts';

export function siteFromCsv(
  csv: string,
  settings: Partial<SiteSettings> = {},
): { site: Site; problems: Problem[] } {
  const parsed = parseEquipmentTable(readCsv(csv));
  const site: Site = {
    settings: {
      name: 'test site',
      hz: 50,
      cases: parsed.cases,
      requirement: { kind: 'cosphi', target: 0.95 },
      ...settings,
    },
    equipment: parsed.equipment,
  };
  return { site, problems: parsed.problems };
}

/** Messages of the problems, for compact assertions. */
export const messages = (ps: readonly Problem[]) => ps.map((p) => p.message);
