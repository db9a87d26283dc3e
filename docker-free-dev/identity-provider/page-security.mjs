// @ts-check
// HTTP helpers shared by the fake's own pages (sign-in, set-password): strict security headers
// and the client's address.

/**
 * Headers for our HTML pages: nothing but our own stylesheet may load, no framing, no referrer
 * (the set-password address carries its ticket) and no caching. No form-action: browsers
 * apply it to the redirect that follows a form post, and ours go on to the app's origin.
 * @param {import('express').Request} _req
 * @param {import('express').Response} res
 * @param {import('express').NextFunction} next
 * @returns {void}
 */
export function pageSecurity(_req, res, next) {
  res.set({
    'Content-Security-Policy':
      "default-src 'none'; style-src 'self'; img-src 'self' data:; frame-ancestors 'none'; base-uri 'none'",
    'X-Content-Type-Options': 'nosniff',
    'Referrer-Policy': 'no-referrer',
    'Cache-Control': 'no-store',
  });
  next();
}

/**
 * The client's address as the app records it (IPv4-mapped IPv6 shown as plain IPv4). The fake
 * is reached directly, never through a proxy, so the socket's address is the client's.
 * @param {import('express').Request} req
 */
export function clientAddress(req) {
  const address = req.socket.remoteAddress ?? '';
  return address.startsWith('::ffff:') ? address.slice(7) : address;
}
