// Entry point of the page.
import './styles/tokens.css';
import './styles/layout.css';
import './styles/formula.css';
import './styles/grid.css';
import './styles/panels.css';
import './styles/checks.css';
import './styles/diagram.css';
import './styles/diagramPanel.css';
import { boot } from './app/boot.ts';

const root = document.getElementById('app');
if (root) {
  boot(root).catch((e: unknown) => {
    const p = document.createElement('p');
    p.className = 'kl-boot-failure';
    p.textContent = `Kvar Ledger could not start: ${e instanceof Error ? e.message : String(e)}`;
    root.replaceChildren(p);
    throw e;
  });
}
