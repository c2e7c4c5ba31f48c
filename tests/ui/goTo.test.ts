import { describe, expect, it } from 'vitest';
import { goTo, type GoToSheet } from '../../src/ui/model/goTo.ts';

const sheets: GoToSheet[] = [
  { id: 0, name: 'Site', cells: () => [['Setting', 'Value']] },
  {
    id: 3,
    name: 'Motors',
    headers: ['Tag', 'Description', 'Bus'],
    cells: () => [
      ['Tag', 'Description', 'Bus'],
      ['P-101', 'pump', 'LV1'],
      ['CMP-A', 'compressor', 'LV1'],
    ],
  },
  { id: 5, name: 'Capacitors and reactors', headers: ['Tag'], cells: () => [['Tag'], ['C1']] },
  {
    id: 7,
    name: 'Buses',
    headers: ['Bus', 'Level'],
    cells: () => [
      ['Bus', 'Level'],
      ['POC', 0],
      ['LV1', 1],
    ],
  },
];

describe('go to', () => {
  it('takes an address with a sheet, quoted or not, or on the sheet on screen', () => {
    expect(goTo('Motors!F12', sheets, 0)).toEqual({ ok: true, sheet: 3, row: 11, col: 5 });
    expect(goTo("'Capacitors and reactors'!B3", sheets, 0)).toEqual({ ok: true, sheet: 5, row: 2, col: 1 });
    expect(goTo('motors!$AA$1', sheets, 0)).toEqual({ ok: true, sheet: 3, row: 0, col: 26 });
    expect(goTo(' c5 ', sheets, 7)).toEqual({ ok: true, sheet: 7, row: 4, col: 2 });
  });
  it('finds a tag, then a bus on the bus list', () => {
    expect(goTo('cmp-a', sheets, 0)).toEqual({ ok: true, sheet: 3, row: 2, col: 0 });
    expect(goTo('LV1', sheets, 0)).toEqual({ ok: true, sheet: 7, row: 2, col: 0 });
  });
  it('says what it could not find', () => {
    expect(goTo('Pumps!A1', sheets, 0)).toEqual({ ok: false, message: 'There is no sheet named "Pumps".' });
    expect(goTo('XYZ-9', sheets, 0)).toMatchObject({
      ok: false,
      message: expect.stringMatching(/^"XYZ-9" is neither/),
    });
    expect(goTo('', sheets, 0)).toMatchObject({ ok: false });
  });
});
