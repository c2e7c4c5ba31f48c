import { readFileSync } from 'node:fs';
import { buildWorkbook } from './src/core/workbook/build.ts';
import { WorkbookSession } from './src/ui/model/session.ts';
import { applyEdit } from './tests/ui/living/edits.ts';
import { siteFromWorkbook } from './src/core/workbook/readSite.ts';
import { rollUp } from './src/core/site/rollup.ts';
const [{ site, banks }, edits] = JSON.parse(readFileSync('/tmp/cex.json', 'utf8'));
const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live', banks }));
for (const e of edits) console.log(applyEdit(s, e));
const read = siteFromWorkbook(s.toDoc());
for (const c of read.site.settings.cases) { const b = rollUp(read.site, c); console.log(c, b.root.p_kw, b.root.q_kvar, b.problems.map(p=>p.message).slice(0,3)); }
console.log(read.problems.slice(0,3));
const b0 = rollUp(read.site, read.site.settings.cases[0]!);
console.log([...b0.elements].sort((a,b)=>Math.abs(b.q_kvar)-Math.abs(a.q_kvar)).slice(0,4));
console.log(b0.buses.slice(0,3).map(b=>[b.bus,b.p_kw,b.q_kvar]));
