// The page's static file server, for `./firn.sh start` (node web/serve.mjs SITE_DIR [/sub/path/]
// [PORT]) and the browser tests: 127.0.0.1, a random free port unless given, correct MIME types
// (application/wasm matters: browsers only stream-compile wasm served with it), the site mounted
// under any sub-path, the served folder swappable (update tests) and every request recorded.
import {createReadStream, statSync} from 'node:fs';
import {createServer} from 'node:http';
import {extname, join, normalize, sep} from 'node:path';
import {pathToFileURL} from 'node:url';

const MIME = {
  '.html': 'text/html; charset=utf-8', '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8', '.css': 'text/css; charset=utf-8',
  '.json': 'application/json', '.webmanifest': 'application/manifest+json',
  '.wasm': 'application/wasm', '.png': 'image/png', '.svg': 'image/svg+xml',
  '.ico': 'image/x-icon', '.txt': 'text/plain; charset=utf-8'
};

// Starts serving `root` under `mount` ('/' or '/a/b/'). Resolves to
// {origin, url, requests, setRoot(dir), close()}.
export function serveSite(root, {mount = '/', port = 0} = {}) {
  if (!mount.startsWith('/') || !mount.endsWith('/')) throw new Error('mount must be /…/');
  const state = {root, requests: []};
  const server = createServer((request, response) => {
    const url = new URL(request.url, 'http://127.0.0.1');
    state.requests.push({method: request.method, path: url.pathname, time: Date.now()});
    const send = (status, text) => {
      response.writeHead(status, {'content-type': 'text/plain; charset=utf-8'});
      response.end(text);
    };
    if (request.method !== 'GET' && request.method !== 'HEAD') return send(405, 'GET only');
    if (!url.pathname.startsWith(mount)) return send(404, 'not found');
    let relative = decodeURIComponent(url.pathname.slice(mount.length)) || 'index.html';
    if (relative.endsWith('/')) relative += 'index.html';
    const file = normalize(join(state.root, relative));
    if (!file.startsWith(normalize(state.root) + sep)) return send(403, 'outside the site');
    let info;
    try {
      info = statSync(file);
    } catch {
      return send(404, 'not found');
    }
    if (!info.isFile()) return send(404, 'not found');
    response.writeHead(200, {
      'content-type': MIME[extname(file)] ?? 'application/octet-stream',
      'content-length': info.size,
      // Like a plain static host: the browser may revalidate; tests must not depend on caching.
      'cache-control': 'no-cache'
    });
    if (request.method === 'HEAD') return response.end();
    createReadStream(file).pipe(response);
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      const origin = `http://127.0.0.1:${server.address().port}`;
      resolve({
        origin,
        url: origin + mount,
        requests: state.requests,
        setRoot(dir) { state.root = dir; },
        close() {
          server.closeAllConnections?.();
          return new Promise((done) => server.close(() => done()));
        }
      });
    });
  });
}

if (import.meta.url === pathToFileURL(process.argv[1]).href) {
  const site = await serveSite(process.argv[2] ?? '.',
                              {mount: process.argv[3] ?? '/', port: Number(process.argv[4] ?? 0)});
  console.log(`serving ${process.argv[2] ?? '.'} at ${site.url}`);
}
