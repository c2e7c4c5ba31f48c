// From the compensation design to a priced schedule: items per bus, the user's rates, the cost.
export { bankSpec, type BankSpec } from './bankSpec.ts';
export { busSchedule, type ScheduleItem, type PricedUnit } from './schedule.ts';
export { siteSchedule, type BusScheduleEntry } from './siteSchedule.ts';
export * as itemRules from './itemRules.ts';
export {
  readRateTable,
  rateTableRows,
  RATE_HEADERS,
  RATE_UNITS,
  SURCHARGES,
  type Rate,
  type RateTable,
  type RateProblem,
  type SurchargeName,
} from './rates.ts';
export { demoRateTable, DEMO_SOURCE, DEMO_CURRENCY } from './demoRates.ts';
export { priceSchedule, type Quote, type BusCost, type CostLine } from './cost.ts';
export { RATES_SHEET, RATES_PURPOSE, ratesSheetDoc, rateRowsOf } from './ratesSheet.ts';
export {
  annualSaving,
  excessKvar,
  type CaseFlow,
  type CaseSaving,
  type Saving,
  type Tariff,
} from './saving.ts';
export {
  TARIFF_SHEET,
  TARIFF_LABELS,
  TARIFF_PURPOSE,
  hoursLabel,
  readTariff,
  tariffRowsOf,
  tariffSheetDoc,
  TARIFF_COL,
  type TariffProblem,
} from './tariffSheet.ts';
