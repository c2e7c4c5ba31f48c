// Hand-made workbook documents for the export tests: invented values, every kind of content.
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';

/** A small invented site: motors with catalogue formulas, a totals sheet, every kind of typed value. */
export function sampleDoc(): WorkbookDoc {
  return {
    format: 'kvar-ledger-workbook',
    version: 1,
    title: 'Invented test works',
    sheets: [
      {
        name: 'Motors',
        purpose: 'motors and their reactive power',
        columns: [
          { header: 'tag', width: 10 },
          { header: 'P out (kW)', format: '0.0' },
          { header: 'eff', format: '0.000' },
          { header: 'cos φ', format: '0.000' },
          { header: 'load', format: '0.00' },
          { header: 'P (kW)', format: '0.00', computed: true },
          { header: 'Q (kvar)', format: '0.00', computed: true },
          { header: 'note' },
        ],
        cells: [
          ['tag', 'P out (kW)', 'eff', 'cos φ', 'load', 'P (kW)', 'Q (kvar)', 'note'],
          ['M-101', 75, 0.95, 0.86, 0.8, '=KW.MOTOR(B2,C2,E2)', '=KVAR.MOTOR(B2,C2,D2,E2)', 'raw water'],
          [
            'M-102',
            132,
            0.962,
            0.88,
            null,
            '=KW.MOTOR(B3,C3,E3)',
            '=KVAR.MOTOR(B3,C3,D3,E3)',
            '=dangerous? no, text',
          ],
          ['M-103', 11, 0.9, 1.3, 1, '=KW.MOTOR(B4,C4,E4)', '=KVAR.MOTOR(B4,C4,D4,E4)', ''],
          ['H-1', '007', true, false, '', '=KVAR.LOAD(40,0.92)', '=IFNA(G4,0)', "'=1+1"],
          [],
          [
            'Σ',
            null,
            null,
            null,
            null,
            '=SUM(F2:F5)',
            '=SUM(G2:G3)+G5',
            'ctrl\u0001char ünï € \uFFFF \uD800',
          ],
        ],
      },
      {
        name: 'Point of connection',
        cells: [
          ['P (kW)', "='Motors'!F7"],
          ['Q (kvar)', '=Motors!G7'],
          ['cos φ', '=COSPHI(B1,B2)'],
          ['tan φ', '=TANPHI(B1,B2)'],
          ['to 0.95', '=KVAR.TOPF(B1,B2,0.95)'],
          ['steps', '=BANK.ROUNDUP(B5,25)'],
          ['div', '=1/0'],
          ['err', '#N/A'],
        ],
      },
    ],
  };
}
