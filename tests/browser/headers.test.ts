// The built page under `vite preview` (the server npm run preview starts): every response carries
// the headers a host must send (src/host/headers.ts), and a page of another origin cannot frame
// the workbook.
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { preview, type PreviewServer } from 'vite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HOST_HEADERS } from '../../src/host/headers.ts';
import { buildApp, launch, ROOT, type Browser } from './harness.ts';

let server: PreviewServer;
let url: string;
let framer: Server;
let framerUrl: string;
let browser: Browser;

beforeAll(async () => {
  await buildApp();
  server = await preview({
    root: ROOT,
    configFile: join(ROOT, 'vite.config.ts'),
    logLevel: 'error',
    preview: { port: 0, host: '127.0.0.1', open: false },
  });
  url = server.resolvedUrls?.local[0] ?? '';
  // Another origin (another port) whose page tries to show the workbook in a frame.
  framer = createServer((_req, res) => {
    res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
    res.end(`<!doctype html><iframe id="victim" src="${url}" width="800" height="600"></iframe>`);
  });
  await new Promise<void>((ok) => framer.listen(0, '127.0.0.1', ok));
  framerUrl = `http://127.0.0.1:${(framer.address() as AddressInfo).port}/`;
  browser = await launch();
});

afterAll(async () => {
  await browser?.close();
  await new Promise((ok) => framer?.close(ok));
  await server?.close();
});

describe('vite preview', () => {
  it('sends the host headers with the page and with its scripts', async () => {
    expect(url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/$/);
    const page = await fetch(url);
    const html = await page.text();
    const script = /src="\.?\/?(assets\/[^"]+\.js)"/.exec(html)?.[1];
    expect(script).toBeDefined();
    const js = await fetch(new URL(script as string, url));
    for (const res of [page, js]) {
      for (const [name, value] of Object.entries(HOST_HEADERS)) expect(res.headers.get(name)).toBe(value);
    }
    expect(js.headers.get('content-type')).toMatch(/javascript/);
  });

  it('cannot be framed by a page of another origin', async () => {
    const refused: string[] = [];
    browser.page.on('console', (m) => {
      if (/^Framing .* violates/.test(m.text())) refused.push(m.text());
    });
    await browser.page.goto(framerUrl);
    // The browser refuses the frame and shows its error page in it instead of the workbook.
    await expect.poll(() => refused.length, { timeout: 15_000 }).toBeGreaterThan(0);
    expect(refused[0]).toMatch(/frame-ancestors 'none'/);
    const frame = browser.page.frames().find((f) => f !== browser.page.mainFrame());
    await expect.poll(() => frame?.url()).toMatch(/^chrome-error:/);
    // Opened directly, the same address shows the workbook.
    await browser.page.goto(url);
    await browser.page.waitForSelector('#app[data-ready="true"]', { timeout: 60_000 });
  });
});
