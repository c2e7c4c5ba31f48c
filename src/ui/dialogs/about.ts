// About Kvar Ledger: what it is, the cautions that come with estimating compensation, and the
// licences of the program and of the two libraries it runs on.
import { el } from '../dom.ts';
import { openDialog } from './dialog.ts';
import { GRID_ON_EVALUATION_KEY } from '../grid/hotModules.ts';

export const CAUTIONS: readonly string[] = [
  'Kvar Ledger estimates. Its figures are for pricing and early decisions, not a design.',
  'Capacitor banks, harmonic resonance and switching overvoltage can hurt people and damage plant: banks hold a dangerous charge after switch-off, a bank tuned near a harmonic can overheat or fail, and overcompensation raises voltage at light load.',
  "The final design must follow local codes and the utility's rules, with studies and sign-off by a licensed engineer.",
];

export const LICENCE_LINES: readonly string[] = [
  'Kvar Ledger is free software under the GNU General Public License version 3 (GPL-3.0-only).',
  'Formula engine: HyperFormula, used under GPL-3.0 (licence key "gpl-v3") — this is why the whole program is GPL-3.0.',
  GRID_ON_EVALUATION_KEY
    ? 'Grid: Handsontable, running under its evaluation key ("non-commercial-and-evaluation"): free for non-commercial use and evaluation only.'
    : 'Grid: Handsontable, running under the commercial licence key this copy was built with.',
  'A firm that uses Kvar Ledger to price work is a commercial user: it needs a commercial Handsontable licence from its maker, and builds the app with its key (VITE_GRID_LICENSE_KEY, see the README).',
  'The xlsx reader and writer (ExcelJS, MIT licence) loads only when you import or export a spreadsheet.',
];

export function openAbout(catalogueSize: number): void {
  const section = (title: string, lines: readonly string[], cls = '') =>
    el('section', { className: `kl-about-section ${cls}` }, [
      el('h3', { text: title }),
      ...lines.map((t) => el('p', { text: t })),
    ]);
  openDialog(
    'About Kvar Ledger',
    [
      el('p', {
        className: 'kl-about-lead',
        text: `A workbook for the reactive-power balance of a site: equipment list, bus totals per operating case, power factor at the point of connection and compensation, with ${catalogueSize} documented engineering functions that stay live in the exported spreadsheet.`,
      }),
      section('Cautions', CAUTIONS, 'is-caution'),
      section('Licences', LICENCE_LINES),
      section('Your data', [
        'Workbooks stay in this browser (IndexedDB) and in files you save. Nothing is sent anywhere.',
      ]),
    ],
    [{ label: 'Close', kind: 'primary' }],
    { wide: true, testId: 'about' },
  );
}
