// A new blank site: the Site sheet with its defaults and the cautions, every equipment sheet
// empty, and empty Buses and Compensation sheets that fill in as equipment is typed.
import type { Site } from '../site/model.ts';
import type { WorkbookDoc } from './document.ts';
import { inputsFromSite } from './inputsFromSite.ts';
import { renderWorkbook } from './render.ts';

/** Defaults of a new site (common practice: 0.95 is the most common tariff threshold; 50 Hz). */
export const BLANK_SITE: Site = {
  settings: {
    name: 'New site',
    hz: 50,
    cases: ['normal'],
    requirement: { kind: 'cosphi', target: 0.95 },
  },
  equipment: [],
};

export function blankSiteWorkbook(name = BLANK_SITE.settings.name): WorkbookDoc {
  const site: Site = { ...BLANK_SITE, settings: { ...BLANK_SITE.settings, name } };
  return renderWorkbook(inputsFromSite(site, []), { flavour: 'live' }).doc;
}
