// Registration of our own engine plugins. The engine's plugin registry is global and only
// engines built after a registration see the plugin, so every engine is built through
// src/engine/index.ts, which registers first. Plugins registered here are also the ones the
// plain-formula engine leaves out.
import { HyperFormula } from 'hyperformula';
import type { FunctionPluginDefinition } from 'hyperformula';
import { CATALOGUE_TRANSLATIONS, CataloguePlugin } from './plugin.ts';

export interface OwnPlugin {
  readonly plugin: FunctionPluginDefinition;
  /** language code → function id → name in that language (at least enGB). */
  readonly translations: Record<string, Record<string, string>>;
}

const registered = new Set<FunctionPluginDefinition>();

/** Register one of our plugins globally; registering the same class again does nothing. */
export function registerOwnPlugin({ plugin, translations }: OwnPlugin): void {
  if (registered.has(plugin)) return;
  HyperFormula.registerFunctionPlugin(plugin, translations);
  registered.add(plugin);
}

export function isOwnPlugin(plugin: FunctionPluginDefinition): boolean {
  return registered.has(plugin) || plugin === CataloguePlugin;
}

export const CATALOGUE_PLUGIN: OwnPlugin = { plugin: CataloguePlugin, translations: CATALOGUE_TRANSLATIONS };

export function registerCataloguePlugin(): void {
  registerOwnPlugin(CATALOGUE_PLUGIN);
}

/** The engine's standard plugins: everything registered that is not ours. */
export function standardPlugins(): FunctionPluginDefinition[] {
  return HyperFormula.getAllFunctionPlugins().filter((p) => !isOwnPlugin(p));
}
