// The grid library is imported piece by piece (its base plus the few plugins registered here) to
// keep the initial download inside the budget; the full package would add what we never use.
// The right-click menu is our own (gridContextMenu.ts), smaller than the library's.
import Handsontable from 'handsontable/base';
import { registerPlugin } from 'handsontable/plugins/registry';
import { CopyPaste } from 'handsontable/plugins/copyPaste';
import { Autofill } from 'handsontable/plugins/autofill';
import { ManualColumnResize } from 'handsontable/plugins/manualColumnResize';
// The grid's core styles as a file (not injected by the grid: injectCoreCss is off, see the
// alias in vite.config.ts), then its plain theme, which styles/grid.css recolours.
import 'handsontable/styles/handsontable.min.css';
import 'handsontable/styles/ht-theme-main-no-icons.css';

let registered = false;

export function registerGridModules(): void {
  if (registered) return;
  registerPlugin(CopyPaste);
  registerPlugin(Autofill);
  registerPlugin(ManualColumnResize);
  registered = true;
}

/** The grid library's evaluation key: its non-commercial and evaluation terms. */
export const EVALUATION_KEY = 'non-commercial-and-evaluation';

/**
 * The grid's licence key, a build setting: VITE_GRID_LICENSE_KEY in the environment of
 * `npm run build` (or a .env file) puts a firm's own commercial key in the built page; without
 * it the page runs under the evaluation key.
 */
export const GRID_LICENSE_KEY: string = import.meta.env.VITE_GRID_LICENSE_KEY?.trim() || EVALUATION_KEY;

/** Whether this build runs under the evaluation key (the About box says what that means). */
export const GRID_ON_EVALUATION_KEY = GRID_LICENSE_KEY === EVALUATION_KEY;

export { Handsontable };
