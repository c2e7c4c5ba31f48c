// The design's own choices a command line can give: detuning per bus, the buses that may get a
// capacitor bank, the bus for a shunt reactor, and a significant 3rd harmonic (14 % detuning
// where a bank must be detuned). Given any of them, `balance` has the design propose for the buses
// the file leaves open (src/core/site/sheetChoices.ts): a bank or a detuning the file types on a
// bus wins there, and the output names each option set aside. Bus names are checked against the
// site once it is read.
import type { CompensationOptions } from '../core/site/compensation.ts';
import { DETUNING_CHOICES } from '../core/site/bankRules.ts';
import type { Site } from '../core/site/model.ts';
import type { ParsedArgs } from './args.ts';

export const DESIGN_FLAGS = ['--third-harmonic'] as const;
export const DESIGN_VALUE_OPTIONS = ['--reactor-bus'] as const;
export const DESIGN_LIST_OPTIONS = ['--detune', '--bank-bus'] as const;

const ALLOWED_P = [0, ...DETUNING_CHOICES];

export const DESIGN_OPTIONS_HELP = `Design choices (given any, the design proposes banks for the buses the file leaves open; a bank
or a detuning the file types on a bus wins there, and the output names each option set aside):
  --detune BUS=P     detuning of the bank on BUS, % (${ALLOWED_P.join(', ')}; 0 = plain); may be repeated
  --bank-bus BUS     a bus that may get a capacitor bank (default: every bus whose own items draw
                     kvar); may be repeated
  --reactor-bus BUS  the bus for a shunt reactor (default: the bus with the most charging)
  --third-harmonic   the 3rd harmonic is significant (much single-phase electronic load): where
                     a bank must be detuned, 14 % instead of 7 %`;

export type DesignOptionsResult =
  | { readonly ok: true; readonly options: CompensationOptions | undefined }
  | { readonly ok: false; readonly message: string };

/** The design options of a parsed command line, checked against the site's buses; undefined when none. */
export function readDesignOptions(args: ParsedArgs, site: Site): DesignOptionsResult {
  const buses = new Set(site.equipment.flatMap((r) => [r.bus, ...(r.to_bus ? [r.to_bus] : [])]));
  const known = (option: string, bus: string): string | undefined =>
    buses.has(bus)
      ? undefined
      : `${option}: bus "${bus}" is not on the site; its buses are ${[...buses].sort().join(', ')}`;
  const detuneList = args.lists.get('--detune') ?? [];
  const bankBuses = args.lists.get('--bank-bus') ?? [];
  const reactorBus = args.values.get('--reactor-bus');
  const third = args.flags.has('--third-harmonic');
  if (detuneList.length === 0 && bankBuses.length === 0 && reactorBus === undefined && !third)
    return { ok: true, options: undefined };
  const detuning: Record<string, number> = Object.create(null) as Record<string, number>;
  for (const item of detuneList) {
    const eq = item.lastIndexOf('=');
    const bus = eq > 0 ? item.slice(0, eq).trim() : '';
    const p = eq > 0 ? Number(item.slice(eq + 1).trim()) : NaN;
    if (bus === '' || !ALLOWED_P.includes(p))
      return {
        ok: false,
        message: `--detune must be written BUS=P with P one of ${ALLOWED_P.join(', ')} (%); got "${item}"`,
      };
    const unknown = known('--detune', bus);
    if (unknown) return { ok: false, message: unknown };
    detuning[bus] = p;
  }
  for (const bus of bankBuses) {
    const unknown = known('--bank-bus', bus);
    if (unknown) return { ok: false, message: unknown };
  }
  if (reactorBus !== undefined) {
    const unknown = known('--reactor-bus', reactorBus);
    if (unknown) return { ok: false, message: unknown };
  }
  return {
    ok: true,
    options: {
      ...(detuneList.length > 0 ? { detuning } : {}),
      ...(bankBuses.length > 0 ? { bankBuses } : {}),
      ...(reactorBus !== undefined ? { reactorBus } : {}),
      ...(third ? { thirdHarmonic: true } : {}),
    },
  };
}
