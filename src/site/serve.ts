/**
 * A small static server for a built site, on loopback only: folders serve their index.html, a
 * missing path gets the site's 404 page, and nothing outside the folder is reachable (links are
 * resolved and must stay inside). Every answer carries the site's Content-Security-Policy and
 * `X-Content-Type-Options: nosniff` as HTTP headers, so no published file (a data download
 * included) can run as a page; README lists the same headers for a production server.
 */
import { readFileSync, realpathSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { extname, join, normalize } from 'node:path';
import { isInside } from '../common/paths.ts';

const MIME: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.csv': 'text/csv; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.xml': 'application/xml',
  '.geojson': 'application/geo+json',
  '.md': 'text/markdown; charset=utf-8',
  '.parquet': 'application/vnd.apache.parquet',
};

/** The headers every answer of the site should carry (the same policy as the pages' meta tag). */
export const SECURITY_HEADERS: Record<string, string> = {
  'content-security-policy':
    "default-src 'self'; script-src 'none'; style-src 'self'; img-src 'self' data:; font-src 'self'; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'",
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'no-referrer',
};

/** The regular file a request names inside `base` (a real path), or null. */
function fileFor(base: string, pathname: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(pathname);
  } catch {
    return null;
  }
  if (decoded.includes('\0')) return null;
  try {
    let file = realpathSync(join(base, normalize(decoded)));
    if (statSync(file).isDirectory()) file = realpathSync(join(file, 'index.html'));
    return isInside(base, file) && statSync(file).isFile() ? file : null;
  } catch {
    return null;
  }
}

export async function serveFolder(
  folder: string | (() => string),
  port = 0,
): Promise<{ origin: string; port: number; close: () => Promise<void> }> {
  const root = () => realpathSync(typeof folder === 'string' ? folder : folder());
  const server: Server = createServer((request, response) => {
    try {
      const base = root();
      const file = fileFor(base, new URL(request.url ?? '/', 'http://localhost').pathname);
      if (file === null) {
        const notFound = fileFor(base, '/404.html');
        response
          .writeHead(404, { ...SECURITY_HEADERS, 'content-type': MIME['.html'] as string })
          .end(notFound ? readFileSync(notFound) : 'not found');
        return;
      }
      response
        .writeHead(200, { ...SECURITY_HEADERS, 'content-type': MIME[extname(file)] ?? 'application/octet-stream' })
        .end(readFileSync(file));
    } catch {
      // A malformed request or a site swapped mid-read: answer, never stop serving.
      if (!response.headersSent) response.writeHead(400, { ...SECURITY_HEADERS, 'content-type': 'text/plain; charset=utf-8' });
      response.end('bad request');
    }
  });
  await new Promise<void>((done, fail) => {
    server.once('error', fail);
    server.listen(port, '127.0.0.1', done);
  });
  const address = server.address();
  const actual = typeof address === 'object' && address ? address.port : port;
  return { origin: `http://127.0.0.1:${actual}`, port: actual, close: () => new Promise((done) => server.close(() => done())) };
}
