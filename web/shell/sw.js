// Firn service worker: keeps one complete build of the page on the device so it works offline.
// - install: downloads every file of this build (list and SHA-256 written in by make_site.mjs),
//   checks each against its hash, and only then stores them in a cache named after the build
//   hash. A half-deployed server (some files old, some new) fails the check: nothing is mixed.
// - once complete it takes over at once (skipWaiting): a page already running keeps what it has
//   loaded, and the next time Firn is opened or reloaded every file comes from the new build.
// - activate: deletes this site's caches of other builds.
// - fetch: the build's own files come from its cache; anything else goes to the network. The
//   page asks for its files with ?build=<hash> (make_site.mjs); a request tagged with another
//   build is refused, so a page that started on the old build can never load a new file (it
//   reloads instead; see firn-offline.js).
/*FIRN_BUILD*/ const BUILD = {build: 'unassembled', version: '', label: '', files: []};

const SCOPE = new URL(self.registration.scope);
// Cache names are per origin: the scope path keeps two copies under different paths apart.
const CACHE_PREFIX = 'firn:' + SCOPE.pathname + ':';
const CACHE = CACHE_PREFIX + BUILD.build;
const PRECACHED = new Set(BUILD.files.map((file) => new URL(file.path, SCOPE).href));
const INDEX = new URL('index.html', SCOPE).href;

async function sha256Hex(bytes) {
  const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', bytes));
  return Array.from(digest, (b) => b.toString(16).padStart(2, '0')).join('');
}

async function downloadVerified(file) {
  const url = new URL(file.path, SCOPE).href;
  const response = await fetch(url, {cache: 'no-store', credentials: 'same-origin'});
  if (!response.ok) throw new Error(file.path + ': HTTP ' + response.status);
  const bytes = await response.arrayBuffer();
  if (file.sha256 && (await sha256Hex(bytes)) !== file.sha256) {
    throw new Error(file.path + ' is not the file of build ' + BUILD.build);
  }
  const type = response.headers.get('content-type') || 'application/octet-stream';
  return [url, new Response(bytes, {status: 200, headers: {'content-type': type}})];
}

self.addEventListener('install', (event) => {
  event.waitUntil((async () => {
    const downloaded = await Promise.all(BUILD.files.map(downloadVerified));
    await caches.delete(CACHE);  // a failed earlier attempt may have left part of it
    const cache = await caches.open(CACHE);
    await Promise.all(downloaded.map(([url, response]) => cache.put(url, response)));
    self.skipWaiting();  // not awaited: it settles once activation is under way
  })());
});

self.addEventListener('activate', (event) => {
  event.waitUntil((async () => {
    const names = await caches.keys();
    await Promise.all(names.filter((name) => name.startsWith(CACHE_PREFIX) && name !== CACHE)
                           .map((name) => caches.delete(name)));
  })());
});

self.addEventListener('message', (event) => {
  if (event.data === 'firn-build' && event.source) {
    event.source.postMessage({type: 'firn-build', build: BUILD.build, label: BUILD.label,
                              version: BUILD.version, cache: CACHE});
  }
});

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== SCOPE.origin) return;
  const wanted = url.searchParams.get('build');
  url.search = '';
  url.hash = '';
  let key = url.href;
  if (request.mode === 'navigate' && key === SCOPE.href) key = INDEX;
  if (!PRECACHED.has(key)) return;
  if (wanted !== null && wanted !== BUILD.build) {
    event.respondWith(new Response('Firn build ' + wanted + ' has been replaced by ' + BUILD.build,
                                   {status: 409, headers: {'content-type': 'text/plain'}}));
    return;
  }
  event.respondWith((async () => {
    const cache = await caches.open(CACHE);
    const hit = await cache.match(key);
    // Only when the browser has evicted the cache: better the network than nothing.
    return hit || fetch(request);
  })());
});
