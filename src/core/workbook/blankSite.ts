// A new blank site: the Site sheet with its defaults and the cautions, every equipment sheet
// empty, and empty Buses and Compensation sheets that fill in as equipment is typed.
import { defaultSettings } from '../site/defaults.ts';
import type { Site } from '../site/model.ts';
import type { WorkbookDoc } from './document.ts';
import { inputsFromSite } from './inputsFromSite.ts';
import { renderWorkbook } from './render.ts';

/** A new site: the default settings (core/site/defaults.ts), no equipment. */
export const BLANK_SITE: Site = {
  settings: defaultSettings('New site'),
  equipment: [],
};

export function blankSiteWorkbook(name = BLANK_SITE.settings.name): WorkbookDoc {
  const site: Site = { ...BLANK_SITE, settings: { ...BLANK_SITE.settings, name } };
  return renderWorkbook(inputsFromSite(site, []), { flavour: 'live' }).doc;
}
