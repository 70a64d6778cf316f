/*
 * Lagwise's site-walk worker. It keeps the site-walk page and the files it loads, so the page
 * opens again in a plant room with no signal; the consultant's changes themselves live in the
 * page's own storage until they are sent. Pages: the network first, the kept copy when there is
 * no answer. Built files (their names change with their content): the kept copy first.
 * Signing out clears everything kept; so does a walk page the server no longer gives this person.
 * Registered for the whole site so it sees the sign-out, but it answers only for the walk pages
 * and the built files; everything else goes to the network untouched.
 */
const CACHE = 'lagwise-walk-v1';
const WALK_PAGE = /^\/desk\/leads\/[0-9a-f-]{36}\/site-walk$/;

self.addEventListener('install', () => {
  self.skipWaiting();
});

self.addEventListener('activate', (event) => {
  event.waitUntil(self.clients.claim());
});

async function pageFromNetworkFirst(request) {
  const cache = await caches.open(CACHE);
  try {
    const response = await fetch(request);
    const url = new URL(request.url);
    if (response.ok && response.type === 'basic') await cache.put(url.origin + url.pathname, response.clone());
    // Signed out, handed back, or no longer this person's: the kept copy goes too.
    else await cache.delete(url.origin + url.pathname);
    return response;
  } catch (error) {
    const kept = await cache.match(request, { ignoreSearch: true });
    if (kept) return kept;
    throw error;
  }
}

async function builtFileFromCacheFirst(request) {
  const cache = await caches.open(CACHE);
  const kept = await cache.match(request);
  if (kept) return kept;
  const response = await fetch(request);
  if (response.ok && response.type === 'basic') await cache.put(request, response.clone());
  return response;
}

self.addEventListener('fetch', (event) => {
  const request = event.request;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (url.pathname === '/api/sign-out') {
    event.waitUntil(caches.delete(CACHE));
    return;
  }
  if (request.method !== 'GET') return;
  if (request.mode === 'navigate' && WALK_PAGE.test(url.pathname)) {
    event.respondWith(pageFromNetworkFirst(request));
  } else if (url.pathname.startsWith('/_astro/') || url.pathname === '/favicon.svg') {
    event.respondWith(
      (async () => {
        // Only a walk page's files are kept; other pages fetch theirs as if there were no worker.
        const client = event.clientId ? await self.clients.get(event.clientId) : undefined;
        return client && WALK_PAGE.test(new URL(client.url).pathname) ? builtFileFromCacheFirst(request) : fetch(request);
      })(),
    );
  }
});
