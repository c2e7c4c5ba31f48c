// Nothing typed is lost when the page goes away: when it is hidden or closed, the pending save is
// issued at once (before anything is awaited), and while a change is not yet safe in the browser
// the browser asks before the page is closed or reloaded.
import type { App } from './app.ts';

export function watchPageLife(app: App, win: Window = window, doc: Document = document): void {
  doc.addEventListener('visibilitychange', () => {
    if (doc.visibilityState === 'hidden') app.flushNow();
  });
  win.addEventListener('pagehide', () => app.flushNow());
  win.addEventListener('beforeunload', (e) => {
    if (!app.unsafeToClose) return;
    e.preventDefault();
    // Older browsers ask only when returnValue is set.
    e.returnValue = '';
  });
}
