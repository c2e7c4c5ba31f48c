// A few workbooks edited as a user would, through the page's model (the same random sites and
// edits as the living-model property test, with fixed seeds), in the form the page exports.
import fc from 'fast-check';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import { handOffDoc } from '../../src/ui/app/handOff.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { siteArb } from '../ui/living/siteArb.ts';
import { applyEdit, editArb } from '../ui/living/edits.ts';

export function editedWorkbooks(count: number): WorkbookDoc[] {
  const sites = fc.sample(
    siteArb.filter((x) => x.site.equipment.length < 60),
    { numRuns: count, seed: 20261202 },
  );
  const edits = fc.sample(fc.array(editArb, { minLength: 10, maxLength: 20 }), { numRuns: count, seed: 9 });
  return sites.map(({ site, banks }, i) => {
    const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live', banks }));
    for (const e of edits[i] ?? []) applyEdit(s, e);
    const doc = handOffDoc(s.toDoc()).doc;
    s.destroy();
    return doc;
  });
}
