/**
 * Lets the site-walk page open again without a connection: registers the site-walk worker
 * (public/walk-sw.js, which answers from its copy when the network does not) and puts this
 * page and every built file it loaded into that copy now, while there is a connection.
 */
const CACHE = 'lagwise-walk-v1';

/** Keeps the page for offline use; anything the browser refuses (a private window) is skipped quietly. */
export async function keepPageForOffline(): Promise<void> {
  if (!('serviceWorker' in navigator) || !('caches' in window)) return;
  try {
    await navigator.serviceWorker.register('/walk-sw.js', { scope: '/' });
    const files = performance
      .getEntriesByType('resource')
      .map((entry) => new URL(entry.name))
      .filter((url) => url.origin === location.origin && url.pathname.startsWith('/_astro/'))
      .map((url) => url.pathname);
    const cache = await caches.open(CACHE);
    await cache.addAll([location.pathname, ...new Set(files)]);
  } catch {
    // Without the copy the page still works online, and the changes are still kept on the phone.
  }
}
