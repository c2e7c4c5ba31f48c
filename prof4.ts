import { readFileSync } from 'node:fs';
import { readSiteFile } from './src/core/site/siteFile.ts';
import { buildWorkbook } from './src/core/workbook/build.ts';
import { WorkbookSession } from './src/ui/model/session.ts';
const { site } = readSiteFile(readFileSync(`templates/cold-store.json`, 'utf8'));
const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
s.setTitle('Reopened from disk');
console.log(s.title, s.toDoc().title, WorkbookSession.fromDoc(s.toDoc()).title);
