import { buildWorkbook } from './src/core/workbook/build.ts';
import { PLANT } from './tests/core/workbook/sites.ts';
const doc = buildWorkbook(PLANT, { flavour: 'live' });
for (const s of doc.sheets) s.cells.forEach((r, i) => { if (r.length !== s.columns?.length) console.log(s.name, i, r.length, s.columns?.length); });
