// The headers a host sends agree with the page's own policy, and vite preview sends them.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEV_HEADERS, HOST_HEADERS, PAGE_POLICY } from '../../src/host/headers.ts';
import config from '../../vite.config.ts';

describe('host headers', () => {
  it('repeat the page policy of index.html and add what only a header can say', () => {
    const html = readFileSync(new URL('../../index.html', import.meta.url), 'utf8');
    const meta = /http-equiv="Content-Security-Policy"\s+content="([^"]+)"/.exec(html)?.[1];
    expect(meta).toBe(PAGE_POLICY);
    expect(HOST_HEADERS['Content-Security-Policy']).toBe(`${PAGE_POLICY}; frame-ancestors 'none'`);
    expect(HOST_HEADERS['X-Frame-Options']).toBe('DENY');
    expect(HOST_HEADERS['X-Content-Type-Options']).toBe('nosniff');
  });

  it('are configured for vite preview and, framing rules only, for the development server', () => {
    const c = config as { preview?: { headers?: unknown }; server?: { headers?: unknown } };
    expect(c.preview?.headers).toEqual(HOST_HEADERS);
    expect(c.server?.headers).toEqual(DEV_HEADERS);
    expect(DEV_HEADERS['Content-Security-Policy']).toBe("frame-ancestors 'none'");
  });
});
