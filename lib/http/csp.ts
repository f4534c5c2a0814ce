// The Content-Security-Policy of Quadrille's pages. Scripts run only with the
// page's one-time nonce (Next.js puts it on its own scripts when it finds it in
// the request's policy) and what those scripts load ('strict-dynamic'); nothing
// else is fetched from, sent to, framed by or posted to another site.
// Styles allow inline attributes: React and the canvas set element styles, and a
// style cannot run code. In development React also needs eval for its error overlay.

/** A fresh, unguessable nonce (128 random bits), base64 as CSP's nonce-source expects. */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

export function pagePolicy(nonce: string, dev = process.env.NODE_ENV === 'development'): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

// API answers get a policy of their own in next.config.mjs: default-src 'none' (an SVG or
// file opened straight from the API runs nothing) and no framing.
