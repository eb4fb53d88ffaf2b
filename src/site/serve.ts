/**
 * A small static server for a built site, on loopback only: folders serve their index.html, a
 * missing path gets the site's 404 page, and nothing outside the folder is reachable.
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { extname, join, normalize, resolve } from 'node:path';

const MIME: Record<string, string> = {
  '.html': 'text/html; charset=utf-8', '.css': 'text/css; charset=utf-8', '.json': 'application/json', '.csv': 'text/csv; charset=utf-8',
  '.svg': 'image/svg+xml', '.png': 'image/png', '.xml': 'application/xml', '.geojson': 'application/geo+json', '.md': 'text/markdown; charset=utf-8',
};

export async function serveFolder(folder: string | (() => string), port = 0): Promise<{ origin: string; port: number; close: () => Promise<void> }> {
  const root = () => resolve(typeof folder === 'string' ? folder : folder());
  const server: Server = createServer((request, response) => {
    const base = root();
    const path = normalize(decodeURIComponent(new URL(request.url ?? '/', 'http://localhost').pathname));
    let file = join(base, path);
    if (existsSync(file) && statSync(file).isDirectory()) file = join(file, 'index.html');
    if (!file.startsWith(base) || !existsSync(file)) {
      const notFound = join(base, '404.html');
      response.writeHead(404, { 'content-type': MIME['.html'] as string }).end(existsSync(notFound) ? readFileSync(notFound) : 'not found');
      return;
    }
    response.writeHead(200, { 'content-type': MIME[extname(file)] ?? 'application/octet-stream' }).end(readFileSync(file));
  });
  await new Promise<void>((done, fail) => {
    server.once('error', fail);
    server.listen(port, '127.0.0.1', done);
  });
  const address = server.address();
  const actual = typeof address === 'object' && address ? address.port : port;
  return { origin: `http://127.0.0.1:${actual}`, port: actual, close: () => new Promise((done) => server.close(() => done())) };
}
