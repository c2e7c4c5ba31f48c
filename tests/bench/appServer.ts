// The app as a user gets it: built by vite into a temporary directory and served on 127.0.0.1
// by a small static file server. Also measures the initial JavaScript: the entry chunk(s) the
// built index.html loads before anything is fetched on demand, raw and gzipped.
import { readFileSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { extname, join, normalize, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

const REPO = fileURLToPath(new URL('../../', import.meta.url));

export async function buildApp(outDir: string): Promise<void> {
  const { build } = await import('vite');
  await build({
    root: REPO,
    configFile: join(REPO, 'vite.config.ts'),
    logLevel: 'error',
    build: { outDir, emptyOutDir: true },
  });
}

/** Scripts and module preloads referenced by the built index.html (relative to outDir). */
export function initialScripts(outDir: string): string[] {
  const html = readFileSync(join(outDir, 'index.html'), 'utf8');
  const found = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*\bsrc="([^"]+)"/g)) found.add(m[1] as string);
  for (const m of html.matchAll(
    /<link[^>]*rel="modulepreload"[^>]*href="([^"]+)"|<link[^>]*href="([^"]+)"[^>]*rel="modulepreload"/g,
  ))
    found.add((m[1] ?? m[2]) as string);
  return [...found].filter((u) => !/^[a-z]+:/i.test(u)).map((u) => u.replace(/^\.?\//, ''));
}

export function initialJsSize(outDir: string): { files: string[]; bytes: number; gzipBytes: number } {
  const files = initialScripts(outDir);
  let bytes = 0;
  let gzipBytes = 0;
  for (const f of files) {
    const data = readFileSync(join(outDir, f));
    bytes += data.byteLength;
    gzipBytes += gzipSync(data, { level: 9 }).byteLength;
  }
  return { files, bytes, gzipBytes };
}

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript',
  '.mjs': 'text/javascript',
  '.css': 'text/css',
  '.json': 'application/json',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
  '.ico': 'image/x-icon',
};

/** Serve `dir` on 127.0.0.1 (a free port); resolves with the base URL and the server to close. */
export function serveStatic(dir: string): Promise<{ url: string; server: Server }> {
  const root = normalize(dir + sep);
  const server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    const file = normalize(join(root, path.endsWith('/') ? path + 'index.html' : path));
    if (!file.startsWith(root)) return void res.writeHead(403).end();
    try {
      if (!statSync(file).isFile()) throw new Error('not a file');
      res
        .writeHead(200, {
          'content-type': TYPES[extname(file)] ?? 'application/octet-stream',
          'cache-control': 'no-store',
        })
        .end(readFileSync(file));
    } catch {
      res.writeHead(404).end();
    }
  });
  return new Promise((resolve) =>
    server.listen(0, '127.0.0.1', () =>
      resolve({ url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/`, server }),
    ),
  );
}
