// The design options a site is compared in (compare.ts prices and judges them): the banks as
// given, the design's proposal, plain capacitors, every bank detuned, one bank at the point of
// connection. Here, apart from the pricing, so a new or older workbook's Design options sheet can
// be drafted where the workbook is rendered.
import type { BankChoice } from './bankChoice.ts';
import { proposeChoices } from './compensation.ts';
import { buildBusGraph } from './graph.ts';
import type { Site } from './model.ts';
import { busVoltages } from './voltages.ts';
import { OPTIONS_UNASKED_MAX_ROWS } from './limits.ts';

export type OptionId = 'current' | 'proposal' | 'plain' | 'detuned' | 'central';

/**
 * The Design options sheet's blocks by the standard option each starts as: the id names the
 * block, whatever the user then types into it.
 */
export const BLOCK_IDS = ['proposal', 'plain', 'detuned', 'central'] as const satisfies readonly OptionId[];

export interface OptionSpec {
  readonly id: OptionId;
  readonly name: string;
  /** What the option is, in a line. */
  readonly summary: string;
  readonly banks: readonly BankChoice[];
  /**
   * What in the option's inputs could not be read (messages with sheet, row and column): such an
   * option is listed with them, not worked out, until they are mended.
   */
  readonly unread?: readonly string[];
}

/** The banks a workbook or site file holds, as the first design compared. */
export function givenOption(held: readonly BankChoice[]): OptionSpec {
  return {
    id: 'current',
    name: 'Banks as given',
    summary: "the banks the workbook's Compensation sheet or the site file holds",
    banks: held,
  };
}

/** The detuning the common options give every bus, % (0 = plain capacitors). */
export const DETUNED_OPTION_P = 7;

/**
 * The options compared for a site: the banks it holds (when it holds any), the design's
 * proposal, plain capacitors on every bus, 7 % detuning on every bus, and one bank at the point
 * of connection. A site that does not roll up gets none.
 */
export function standardOptions(site: Site, held: readonly BankChoice[] | undefined): OptionSpec[] {
  const graph = buildBusGraph(site.equipment);
  if (graph.root === undefined) return [];
  const everyBus = (p: number) => Object.fromEntries(graph.order.map((b) => [b, p]));
  const out: OptionSpec[] = [];
  if (held !== undefined) out.push(givenOption(held));
  out.push(
    {
      id: 'proposal',
      name: 'Proposed design',
      summary: 'a bank on each bus whose own items draw kvar, detuned where harmonic sources call for it',
      banks: proposeChoices(site),
    },
    {
      id: 'plain',
      name: 'Plain capacitors',
      summary: 'the proposed buses, no detuning reactors anywhere',
      banks: proposeChoices(site, { detuning: everyBus(0) }),
    },
    {
      id: 'detuned',
      name: `All detuned ${DETUNED_OPTION_P} %`,
      summary: `the proposed buses, every bank with ${DETUNED_OPTION_P} % detuning reactors`,
      banks: proposeChoices(site, { detuning: everyBus(DETUNED_OPTION_P) }),
    },
    {
      id: 'central',
      name: 'One bank at the connection',
      summary: busVoltages(site.equipment).voltages.has(graph.root)
        ? `a single bank on ${graph.root}, the point of connection; the transformers below still carry their kvar`
        : `no bank: no row on ${graph.root}, the point of connection, states its voltage (u_kv), so no bank there can be sized`,
      banks: proposeChoices(site, { bankBuses: [graph.root] }),
    },
  );
  return out;
}

/**
 * The options a new workbook starts with on its Design options sheet: the standard ones less the
 * banks as given (its Compensation sheet holds those). None above OPTIONS_UNASKED_MAX_ROWS rows,
 * where four designs would take seconds and the sheet keeps inputs only; none either for a site
 * the design cannot balance (losses that run away, a broken bus graph): the workbook still opens,
 * with blank option blocks, and Checks runs the same design and says why.
 */
export function draftOptions(site: Site): OptionSpec[] {
  if (site.equipment.length > OPTIONS_UNASKED_MAX_ROWS) return [];
  try {
    return standardOptions(site, undefined);
  } catch (e) {
    if (e instanceof Error) return [];
    throw e;
  }
}
