// The solar template with one more 33 kV cable, energised at night only, and a plain bank typed
// on block A's 33 kV bus (joined to the collector bus by its cable feeder: one zone), with the
// figures worked by hand (sources in tests/core/workbook/zoneCharging.test.ts).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BankChoice } from '../../../src/core/site/bankChoice.ts';
import type { Site } from '../../../src/core/site/model.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';

const SOLAR = join(import.meta.dirname, '../../../templates/solar-collector.json');
export const raw = JSON.parse(readFileSync(SOLAR, 'utf8')) as {
  settings: { sscMva: number };
  equipment: Array<Record<string, number | string>>;
};
const base = readSiteFile(readFileSync(SOLAR, 'utf8')).site;
// A 33 kV cable of 3 km at 0.3 µF/km on block B's bus, energised at night only (invented).
export const CABLE = { u: 33, c: 0.3e-6, len: 3 };
export const site: Site = {
  ...base,
  equipment: [
    ...base.equipment,
    {
      row: 1000,
      tag: 'CB-X',
      bus: 'BLK-B',
      kind: 'cable',
      values: { u_kv: CABLE.u, c_uf_km: CABLE.c * 1e6, len_km: CABLE.len },
      loads: { noon: 0, night: 1 },
    },
  ],
};
export const bank: BankChoice = { bus: 'BLK-A', fixed_kvar: 0, step_kvar: 300, steps: 4 };

// Hand figures.
const q = (cF: number, len: number, uKv: number) => (2 * Math.PI * 50 * cF * len * (uKv * 1e3) ** 2) / 1e3;
export const lines = raw.equipment
  .filter((r) => r.kind === 'line')
  .reduce((s, r) => s + q((r.c_nf_km as number) * 1e-9, r.len_km as number, 33), 0);
export const cable = q(CABLE.c, CABLE.len, CABLE.u); // about 308 kvar
export const nightCharging = lines + cable;
const gt = raw.equipment.find((r) => r.tag === 'GT1') as Record<string, number>;
const sscMv = 1 / (1 / raw.settings.sscMva + (gt.uk_pct as number) / 100 / ((gt.s_kva as number) / 1000));
const fa = raw.equipment.find((r) => r.tag === 'F-A') as Record<string, number>;
const xLine = 2 * Math.PI * 50 * (fa.l_mh_km as number) * 1e-3 * (fa.len_km as number);
export const sscA = 1 / (1 / sscMv + xLine / 33 ** 2); // MVA at BLK-A
export const order = (kvar: number) => Math.sqrt((sscA * 1000) / kvar);
