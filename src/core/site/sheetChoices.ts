// The design as it reads the Compensation sheet's choices per bus. Three kinds of bus row:
// - a bank typed (a size: fixed part or steps) or a reactor typed: kept as typed, the design
//   proposes nothing there and sizes what the typed banks leave to the other buses;
// - a detuning p (%) typed alone (no size): the design proposes that bus's bank, with that
//   detuning (the bus gets a bank even if its own items draw no kvar);
// - nothing typed: open, the design proposes as it would for the whole site.
// Design options (the CLI's --detune, --bank-bus, --reactor-bus, --third-harmonic) apply to the
// open buses; where one names a bus the sheet already decides, the sheet wins and the result
// says so (`overridden`).
import { hasBankChoice, hasReactorChoice, type BankChoice } from './bankChoice.ts';
import { compensate } from './compensate.ts';
import {
  choicesFromDesign,
  designCompensation,
  proposeChoices,
  type CompensationOptions,
} from './compensation.ts';
import type { Site } from './model.ts';
import { SiteStructureError, type CaseBalance } from './rollup.ts';
import { bankTotal } from './bankChoice.ts';
import { designWarning, type DesignWarning } from './warnings.ts';

export type ChoiceOrigin = 'typed' | 'detuning typed' | 'proposed';

export interface SheetChoices {
  /** What the Compensation sheet holds after the design: typed rows as typed, the rest proposed. */
  readonly choices: readonly BankChoice[];
  /** Per bus with a choice, where it comes from. */
  readonly origins: ReadonlyMap<string, ChoiceOrigin>;
  /** One sentence per design option the sheet's typed choices won over. */
  readonly overridden: readonly string[];
}

const isTypedBank = (c: BankChoice) => hasBankChoice(c) || hasReactorChoice(c);
/** A row with a detuning p (%) typed and neither bank sizes nor a reactor. */
export const isDetuningOnly = (c: BankChoice) => !isTypedBank(c) && c.p_pct !== undefined && c.p_pct >= 0;

/** Typed choices win over options for their buses; the sentences name each option set aside. */
function optionsForOpenBuses(
  typed: readonly BankChoice[],
  options: CompensationOptions,
): { options: CompensationOptions; overridden: string[] } {
  const banks = new Set(typed.filter(isTypedBank).map((c) => c.bus));
  const detuned = new Map(typed.filter(isDetuningOnly).map((c) => [c.bus, c.p_pct as number]));
  const overridden: string[] = [];
  const detuning: Record<string, number> = Object.create(null) as Record<string, number>;
  for (const [bus, p] of Object.entries(options.detuning ?? {})) {
    if (banks.has(bus)) overridden.push(`--detune ${bus}=${p} set aside: a bank is typed on bus ${bus}`);
    else if (detuned.has(bus) && detuned.get(bus) !== p)
      overridden.push(
        `--detune ${bus}=${p} set aside: detuning ${detuned.get(bus)} % is typed on bus ${bus}`,
      );
    else detuning[bus] = p;
  }
  for (const [bus, p] of detuned) detuning[bus] = p;
  for (const bus of options.bankBuses ?? [])
    if (banks.has(bus)) overridden.push(`--bank-bus ${bus} set aside: a bank is typed on bus ${bus}`);
  const reactorTyped = typed.find(hasReactorChoice);
  if (options.reactorBus !== undefined && reactorTyped)
    overridden.push(
      `--reactor-bus ${options.reactorBus} set aside: a reactor is typed on bus ${reactorTyped.bus}`,
    );
  if (options.thirdHarmonic)
    for (const [bus, p] of detuned)
      overridden.push(`--third-harmonic does not change bus ${bus}: detuning ${p} % is typed there`);
  const bankBuses = options.bankBuses?.filter((b) => !banks.has(b));
  return {
    options: {
      ...options,
      ...(Object.keys(detuning).length > 0 ? { detuning } : {}),
      ...(bankBuses !== undefined ? { bankBuses } : {}),
      ...(reactorTyped ? { reactorBus: undefined } : {}),
      ...(detuned.size > 0 ? { alsoBankBuses: [...detuned.keys()] } : {}),
      ...(banks.size > 0 ? { typedBuses: [...banks] } : {}),
    },
    overridden,
  };
}

/**
 * The design over the sheet's choices (undefined: the file says nothing of banks, every bus open).
 * Typed banks count first: the design sees the site with them in place and proposes what they
 * leave, on the open buses and those with a detuning typed alone.
 */
export function designWithSheet(
  site: Site,
  typed: readonly BankChoice[] | undefined,
  options: CompensationOptions = {},
  /** The site's balances already rolled up (without banks), if any. */
  before?: readonly CaseBalance[],
): SheetChoices {
  const rows = typed ?? [];
  const { options: open, overridden } = optionsForOpenBuses(rows, options);
  const kept = rows.filter(isTypedBank);
  const origins = new Map<string, ChoiceOrigin>(kept.map((c) => [c.bus, 'typed']));
  let proposed: BankChoice[];
  if (kept.length === 0) proposed = proposeChoices(site, open, before);
  else {
    try {
      const withTyped = compensate(site, kept, before).map((r) => r.after);
      const d = designCompensation(site, withTyped, open);
      proposed = choicesFromDesign(d.banks, d.reactors);
    } catch (e) {
      if (!(e instanceof SiteStructureError)) throw e;
      proposed = [];
    }
  }
  const detuned = new Set(rows.filter(isDetuningOnly).map((c) => c.bus));
  for (const c of proposed) origins.set(c.bus, detuned.has(c.bus) ? 'detuning typed' : 'proposed');
  // A detuning typed alone where the design proposes no bank stays on the sheet as typed.
  const leftTyped = rows.filter((c) => isDetuningOnly(c) && !origins.has(c.bus));
  for (const c of leftTyped) origins.set(c.bus, 'detuning typed');
  return {
    choices: [...kept, ...proposed, ...leftTyped],
    origins,
    overridden,
  };
}

const kvar = (x: number) => `${Math.round(x * 10) / 10} kvar`;
const detuningText = (p: number | undefined) => ((p ?? 0) > 0 ? `detuned ${p} %` : 'plain');

/**
 * What Checks says per bus of the Compensation sheet: a bank there (it stands as typed), or a
 * detuning typed alone, with the bank the design proposes for it (what designWithSheet gives).
 */
export function choiceFindings(site: Site, typed: readonly BankChoice[]): DesignWarning[] {
  const out: DesignWarning[] = [];
  for (const c of typed.filter(isTypedBank)) {
    const what = [
      ...(hasBankChoice(c) ? [`bank of ${kvar(bankTotal(c))}, ${detuningText(c.p_pct)}`] : []),
      ...(hasReactorChoice(c) ? [`reactor of ${kvar(c.reactor_kvar ?? 0)}`] : []),
    ].join(' and ');
    out.push(
      designWarning(
        'info',
        'bank-choice',
        { bus: c.bus },
        `on the Compensation sheet (typed, or kept from the design): ${what}; it stands as it is, and the design proposes nothing more on bus ${c.bus}`,
      ),
    );
  }
  if (!typed.some(isDetuningOnly)) return out;
  const d = designWithSheet(site, typed);
  for (const c of typed.filter(isDetuningOnly)) {
    const bank = d.choices.find((x) => x.bus === c.bus && hasBankChoice(x));
    const proposal = bank
      ? `the design proposes a bank of ${kvar(bankTotal(bank))} (${bank.fixed_kvar ? `fixed ${kvar(bank.fixed_kvar)}, ` : ''}${bank.steps ?? 0} stages of ${kvar(bank.step_kvar ?? 0)}) there, ${detuningText(c.p_pct)}: type its sizes to keep it`
      : `the design proposes no bank there (the bus's share of the need is too small or nothing is needed)`;
    out.push(
      designWarning(
        'info',
        'bank-choice',
        { bus: c.bus },
        `detuning ${c.p_pct} % typed alone on the Compensation sheet (no sizes): ${proposal}`,
      ),
    );
  }
  return out;
}
