// The HTTP headers a host must send with the built page (dist/). The page's own
// Content-Security-Policy sits in index.html as a meta element, but a meta policy cannot forbid
// framing (browsers ignore frame-ancestors there) and cannot stop a browser from guessing file
// types. Only response headers can; `vite preview` sends these (vite.config.ts), and any other
// host must send them too (README, "Hosting").

/** The policy of index.html's meta element, word for word (a test keeps the two equal). */
export const PAGE_POLICY =
  "default-src 'self'; script-src 'self'; style-src 'self'; img-src 'self' data: blob:; font-src 'self'; connect-src 'self'; object-src 'none'; base-uri 'none'; form-action 'none'";

/** Headers for every response of the built site. */
export const HOST_HEADERS: Readonly<Record<string, string>> = {
  // The page's policy plus what only a header can say: no page of any origin may frame this one.
  'Content-Security-Policy': `${PAGE_POLICY}; frame-ancestors 'none'`,
  // The same for browsers that predate frame-ancestors.
  'X-Frame-Options': 'DENY',
  // Scripts and styles are run only when served with their own type, never by guessing.
  'X-Content-Type-Options': 'nosniff',
  // The workbook's address (which may name a client's file server) is not passed on by links.
  'Referrer-Policy': 'no-referrer',
  // Another site's window opened from here (or opening this) gets no handle on the page.
  'Cross-Origin-Opener-Policy': 'same-origin',
};

/**
 * The development server (npm start) injects styles and a reload socket that the page's policy
 * would block, so it sends only the framing and type rules.
 */
export const DEV_HEADERS: Readonly<Record<string, string>> = {
  'Content-Security-Policy': "frame-ancestors 'none'",
  'X-Frame-Options': 'DENY',
  'X-Content-Type-Options': 'nosniff',
};
