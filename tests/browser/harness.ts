// Shared set-up for the browser tests: build the app with Vite, serve dist/ on 127.0.0.1 with a
// tiny static server (sending the headers a host must send), and drive Debian's chromium through playwright-core with a fresh profile.
import { createServer, type Server } from 'node:http';
import { mkdtemp, readFile, rm, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { extname, join, normalize, resolve } from 'node:path';
import type { AddressInfo } from 'node:net';
import { build } from 'vite';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { HOST_HEADERS } from '../../src/host/headers.ts';

export const ROOT = resolve(import.meta.dirname, '../..');
export const DIST = join(ROOT, 'dist');
export const ARTIFACTS = join(ROOT, 'test-artifacts');

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.svg': 'image/svg+xml',
};

export async function buildApp(): Promise<void> {
  await build({ root: ROOT, logLevel: 'error', configFile: join(ROOT, 'vite.config.ts') });
}

export async function serve(dir = DIST): Promise<{ url: string; close(): Promise<void> }> {
  const server: Server = createServer(async (req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    const file = normalize(join(dir, path === '/' ? 'index.html' : path));
    if (!file.startsWith(dir)) {
      res.writeHead(403).end();
      return;
    }
    try {
      const body = await readFile(file);
      res.writeHead(200, {
        ...HOST_HEADERS,
        'content-type': TYPES[extname(file)] ?? 'application/octet-stream',
        'cache-control': 'no-store',
      });
      res.end(body);
    } catch {
      res.writeHead(404).end('not found');
    }
  });
  await new Promise<void>((ok) => server.listen(0, '127.0.0.1', ok));
  const { port } = server.address() as AddressInfo;
  return { url: `http://127.0.0.1:${port}/`, close: () => new Promise((ok) => server.close(() => ok())) };
}

export interface Browser {
  readonly context: BrowserContext;
  readonly page: Page;
  /** Console errors and page errors seen so far. */
  readonly errors: string[];
  close(): Promise<void>;
}

export async function launch(): Promise<Browser> {
  const profile = await mkdtemp(join(tmpdir(), 'kl-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1440, height: 860 },
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const errors: string[] = [];
  const watch = (p: Page) => {
    p.on('console', (m) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    p.on('pageerror', (e) => errors.push(e.stack ?? String(e)));
  };
  watch(page);
  context.on('page', watch);
  return {
    context,
    page,
    errors,
    close: async () => {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}

export async function openApp(page: Page, url: string): Promise<void> {
  await page.goto(url);
  await page.waitForSelector('#app[data-ready="true"]', { timeout: 60_000 });
  await page.waitForSelector('.kl-grid-host td');
}

export async function screenshot(page: Page, name: string): Promise<void> {
  await mkdir(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: join(ARTIFACTS, `${name}.png`) });
}

/** A served build in a fresh browser, the app open on the demo, clipboard allowed: one suite's page. */
export interface AppUnderTest {
  readonly server: { url: string; close(): Promise<void> };
  readonly browser: Browser;
  readonly page: Page;
}

export async function startApp(): Promise<AppUnderTest> {
  await buildApp();
  const server = await serve();
  const browser = await launch();
  await browser.context.grantPermissions(['clipboard-read', 'clipboard-write'], {
    origin: server.url.replace(/\/$/, ''),
  });
  await openApp(browser.page, server.url);
  return { server, browser, page: browser.page };
}

export async function stopApp(app: AppUnderTest | undefined): Promise<void> {
  await app?.browser.close();
  await app?.server.close();
}
