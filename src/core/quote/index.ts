// From the compensation design to a priced schedule: items per bus, the user's rates, the cost.
export { bankSpec, type BankSpec } from './bankSpec.ts';
export { busSchedule, type ScheduleItem, type PricedUnit } from './schedule.ts';
export { siteSchedule, type BusScheduleEntry } from './siteSchedule.ts';
export * as itemRules from './itemRules.ts';
