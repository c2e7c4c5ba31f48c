import fc from 'fast-check';
import { buildWorkbook } from './src/core/workbook/build.ts';
import { WorkbookSession } from './src/ui/model/session.ts';
import { siteArb } from './tests/ui/living/siteArb.ts';
const [{ site, banks }] = fc.sample(siteArb.filter((x) => x.site.settings.cases.length >= 3 && new Set(x.site.equipment.map(r=>r.bus)).size > 25), { numRuns: 1, seed: 7 });
console.log('rows', site!.equipment.length, 'cases', site!.settings.cases.length);
let t0 = performance.now();
const doc = buildWorkbook(site!, { flavour: 'live', banks });
console.log('build', performance.now() - t0); t0 = performance.now();
const s = WorkbookSession.fromDoc(doc);
console.log('open', performance.now() - t0); t0 = performance.now();


for (let i = 0; i < 3; i++) { const t1 = performance.now(); const s2 = WorkbookSession.fromDoc(doc); console.log('open again', performance.now() - t1); const t2 = performance.now(); s2.setCells(s2.site!.ids.buses, [{ row: 3, col: 0, content: 'RENAMED' + i }]); console.log('rename', performance.now() - t2); 
const t3 = performance.now(); s2.setCells(s2.site!.ids.buses, [{ row: 3, col: 0, content: 'RENAMEDx' + i }]); console.log('rename2', performance.now() - t3); s2.destroy(); }
