/* Tillwell's offline shell: built into dist/sw.js by the `offlineShell` plugin in vite.config.ts,
 * which replaces SHELL_FILES and SHELL_VERSION. Plain JavaScript: it runs in the worker, not the page. */
const SHELL_FILES = self.__SHELL_FILES__;
const SHELL = `tillwell-shell-${self.__SHELL_VERSION__}`;
// Answers of the API that the offline pages read. Personal: emptied when the signed-in person changes or signs out.
const API = 'tillwell-api';
const OWNER = '/__tillwell-api-owner';

// Only what the plot book, rain gauge, tasks and shifts pages (and the club around them) read. Mail links
// (token routes), feeds, photos and everything else always go to the network.
const API_READS = [
  /^\/api\/session$/,
  /^\/api\/clubs\/\d+$/,
  /^\/api\/clubs\/\d+\/(weather-sites|my-plot|my-shifts|shifts|crops|volunteer-settings)$/,
  /^\/api\/plots\/\d+(\/book|\/tasks)?$/,
  /^\/api\/sites\/\d+(\/weather|\/plots|\/neighbours)?$/,
  /^\/api\/shifts\/\d+$/,
];

const cacheableRead = (url) =>
  url.origin === self.location.origin && API_READS.some((re) => re.test(url.pathname)) && !/token=/i.test(url.search);

self.addEventListener('install', (event) => {
  event.waitUntil(
    caches
      .open(SHELL)
      .then((cache) => cache.addAll(SHELL_FILES))
      .then(() => self.skipWaiting()),
  );
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    caches
      .keys()
      .then((names) => Promise.all(names.filter((n) => n.startsWith('tillwell-shell-') && n !== SHELL).map((n) => caches.delete(n))))
      .then(() => self.clients.claim()),
  );
});

/** Empties the API answers when the session answer names someone else than the answers were kept for. */
async function keepFor(userId) {
  const api = await caches.open(API);
  const owner = await api.match(OWNER);
  const previous = owner ? await owner.text() : null;
  if (previous !== String(userId)) {
    await caches.delete(API);
    if (userId !== null) await (await caches.open(API)).put(OWNER, new Response(String(userId)));
  }
  return userId !== null;
}

async function networkFirst(request, url) {
  try {
    const response = await fetch(request);
    if (url.pathname === '/api/session' && response.ok) {
      const body = await response.clone().json().catch(() => null);
      const userId = body && body.user ? body.user.id : null;
      if (!(await keepFor(userId))) return response;
    }
    if (response.ok) {
      const api = await caches.open(API);
      // Kept only while someone is signed in (the owner entry is there).
      if (await api.match(OWNER)) await api.put(request, response.clone());
    }
    return response;
  } catch (error) {
    const kept = await (await caches.open(API)).match(request);
    if (kept) return kept;
    throw error;
  }
}

self.addEventListener('fetch', (event) => {
  const { request } = event;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (request.method !== 'GET') {
    // Signing out empties the kept answers whatever the network says.
    if (request.method === 'DELETE' && url.pathname === '/api/session') event.waitUntil(caches.delete(API));
    return;
  }
  if (url.pathname.startsWith('/api/')) {
    if (cacheableRead(url)) event.respondWith(networkFirst(request, url));
    return;
  }
  if (request.mode === 'navigate') {
    // Network first, so a new build's page arrives at once; the kept shell when there is no network.
    event.respondWith(fetch(request).catch(() => caches.match('/index.html', { cacheName: SHELL }).then((r) => r || Response.error())));
    return;
  }
  if (SHELL_FILES.includes(url.pathname)) {
    event.respondWith(caches.match(request, { cacheName: SHELL }).then((r) => r || fetch(request)));
  }
});
