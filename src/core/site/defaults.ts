// The settings a site takes where nothing says otherwise: a new blank site, an imported list, a
// site file or Site sheet that leaves them out, a bare list on the command line. One home, so the
// page, the files and the CLI agree on them.
import type { Requirement, SiteSettings } from './model.ts';

/** Frequency of a site that does not state one, Hz. */
export const DEFAULT_HZ = 50;

/** Name of the one operating case of a site that names none. */
export const DEFAULT_CASE = 'normal';

/** Requirement where none is given (common practice: cos φ ≥ 0.95 is the most common tariff threshold). */
export const DEFAULT_REQUIREMENT: Requirement = { kind: 'cosphi', target: 0.95 };

/** Name of a site whose file or Site sheet gives none. */
export const UNTITLED_SITE = 'Untitled site';

/** Default settings under a name (and, when given, the cases). */
export function defaultSettings(name: string, cases: readonly string[] = [DEFAULT_CASE]): SiteSettings {
  return { name, hz: DEFAULT_HZ, cases: [...cases], requirement: DEFAULT_REQUIREMENT };
}
