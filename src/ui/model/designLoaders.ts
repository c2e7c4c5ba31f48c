// The design, kept out of the page's first download, loaded once the workbook is on screen: the
// proposal for a detuning typed alone and the draft of the standard design options. Until each
// has loaded the session leaves that work for later (a detuning stays as typed, option blocks
// stay blank); tests load them first.

/**
 * The design behind a detuning typed alone (detuningProposal.ts): the whole compensation design,
 * kept out of the first download. The page loads it once the workbook is on screen (boot.ts);
 * until it has loaded, a detuning typed alone is left as typed and Checks describes the bank the
 * design would propose. Tests load it before they edit.
 */
export type DetuningProposer = (typeof import('./detuningProposal.ts'))['detuningProposal'];
let detuningProposal: DetuningProposer | undefined;

export async function loadDetuningProposer(): Promise<void> {
  detuningProposal ??= (await import('./detuningProposal.ts')).detuningProposal;
}

/**
 * The standard options for a workbook made or saved before the Design options sheet existed
 * (core/options draftOptionsOfDoc): the design, kept out of the first download like the one
 * above. Such a workbook opens with blank option blocks; once this has loaded the page drafts
 * them (draftMissingOptions).
 */
export type OptionDrafter = (typeof import('../../core/options/index.ts'))['draftOptionsOfDoc'];
let optionDrafter: OptionDrafter | undefined;

export async function loadOptionDrafter(): Promise<void> {
  optionDrafter ??= (await import('../../core/options/index.ts')).draftOptionsOfDoc;
}

/** The detuning proposal, once loadDetuningProposer has run. */
export const loadedDetuningProposal = (): DetuningProposer | undefined => detuningProposal;

/** The options drafter, once loadOptionDrafter has run. */
export const loadedOptionDrafter = (): OptionDrafter | undefined => optionDrafter;
