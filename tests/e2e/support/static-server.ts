import { createReadStream, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { extname, join, normalize, resolve, sep } from 'node:path';

/**
 * A tiny static file server for the built add-in (dist/), on 127.0.0.1 and a
 * port the system picks: just GET and HEAD of files below `root`, with the
 * content types the browser needs, nothing else (no directory listings, no
 * paths outside `root`). Every request is recorded, so a test can see what
 * the page asked for.
 *
 * With `csp`, every response carries that Content-Security-Policy as a
 * header, as a hosting server should: a page's <meta> policy does not reach
 * the Web Workers it starts (a worker takes the policy of its own script's
 * response), so only the header puts the training worker under the policy
 * too. Its `report-uri /csp-report` makes the browser POST every violation,
 * from the page and from its workers, back here, into `reports`.
 */
const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
  '.png': 'image/png',
  '.xml': 'application/xml; charset=utf-8',
  '.txt': 'text/plain; charset=utf-8',
};

export interface StaticServer {
  origin: string;
  /** paths asked for, in order */
  requests: string[];
  /** violation reports the browser sent (their JSON bodies) */
  reports: unknown[];
  close(): Promise<void>;
}

export const REPORT_PATH = '/csp-report';

export async function serveStatic(root: string, options: { csp?: string } = {}): Promise<StaticServer> {
  const base = resolve(root);
  const requests: string[] = [];
  const reports: unknown[] = [];
  const policy = options.csp ? `${options.csp}; report-uri ${REPORT_PATH}` : undefined;
  const server: Server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://localhost').pathname);
    requests.push(path);
    if (req.method === 'POST' && path === REPORT_PATH) {
      let body = '';
      req.setEncoding('utf8');
      req.on('data', (chunk: string) => { if (body.length < 1_000_000) body += chunk; });
      req.on('end', () => {
        try { reports.push(JSON.parse(body)); } catch { reports.push(body); }
        res.writeHead(204).end();
      });
      return;
    }
    if (req.method !== 'GET' && req.method !== 'HEAD') { res.writeHead(405).end(); return; }
    const file = normalize(join(base, path === '/' ? 'preview.html' : path));
    if (file !== base && !file.startsWith(base + sep)) { res.writeHead(403).end(); return; }
    let size: number;
    try {
      const st = statSync(file);
      if (!st.isFile()) throw new Error('not a file');
      size = st.size;
    } catch {
      res.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
      return;
    }
    res.writeHead(200, {
      'content-type': TYPES[extname(file)] ?? 'application/octet-stream',
      'content-length': size,
      'cache-control': 'no-store',
      ...(policy ? { 'content-security-policy': policy } : {}),
    });
    if (req.method === 'HEAD') { res.end(); return; }
    createReadStream(file).pipe(res);
  });
  await new Promise<void>((ok) => server.listen(0, '127.0.0.1', ok));
  const { port } = server.address() as AddressInfo;
  return {
    origin: `http://127.0.0.1:${port}`,
    requests,
    reports,
    close: () => new Promise((ok) => { server.closeAllConnections?.(); server.close(() => ok()); }),
  };
}
