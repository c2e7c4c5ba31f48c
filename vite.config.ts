import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import { DEV_HEADERS, HOST_HEADERS } from './src/host/headers.ts';

// One config for the app build and the three test suites.
// unit: needs nothing beyond `npm install`; browser and crossengine need Debian's
// chromium and libreoffice-calc-nogui (see README).
export default defineConfig({
  base: './',
  plugins: [
    {
      // index.html ships a strict Content-Security-Policy (style-src 'self'). The development
      // server injects CSS as <style> elements, so only there inline styles are allowed.
      name: 'kvar-ledger-dev-csp',
      apply: 'serve',
      transformIndexHtml: (html: string) =>
        html.replace("style-src 'self';", "style-src 'self' 'unsafe-inline';"),
    },
  ],
  resolve: {
    alias: [
      // The grid library carries its core stylesheet twice: as a CSS file and as a JS string it
      // injects at run time. The app loads the CSS file (src/ui/grid/hotModules.ts, with
      // injectCoreCss: false), so the JS copy is replaced by an empty one: ~20 KB gzip less
      // initial JavaScript and no <style> injected by the grid.
      {
        find: /^.*\/styles\/handsontableStyles\.mjs$/,
        replacement: fileURLToPath(new URL('./src/ui/grid/noInjectedGridCss.ts', import.meta.url)),
      },
    ],
  },
  // Response headers the page relies on (framing, type sniffing; see src/host/headers.ts).
  preview: { headers: { ...HOST_HEADERS } },
  server: { headers: { ...DEV_HEADERS } },
  build: {
    target: 'es2022',
    chunkSizeWarningLimit: 2000,
  },
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/**/*.test.ts'],
          exclude: ['tests/browser/**', 'tests/crossengine/**', 'node_modules/**'],
          testTimeout: 30_000,
          // Vitest's default is one worker less than the cores: on a two-core machine (CI's) the
          // unit files then run one at a time. They are independent; use every core.
          maxWorkers: Math.max(2, availableParallelism()),
        },
      },
      {
        test: {
          name: 'browser',
          include: ['tests/browser/**/*.test.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
      {
        test: {
          name: 'crossengine',
          include: ['tests/crossengine/**/*.test.ts'],
          testTimeout: 300_000,
          hookTimeout: 300_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
