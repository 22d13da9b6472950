// Keeps the app itself available offline once it has been opened, so the loom-side guide can be
// reloaded at a loom with no connection (its draft, plan and place are kept in localStorage).
// API answers are never cached here: the pages keep their own offline copies and know how old they are.

interface FetchEventLike {
  request: Request;
  respondWith(response: Promise<Response>): void;
}
interface WorkerScope {
  addEventListener(type: 'fetch', listener: (event: FetchEventLike) => void): void;
  addEventListener(type: 'install' | 'activate', listener: (event: { waitUntil(p: Promise<unknown>): void }) => void): void;
  skipWaiting(): Promise<void>;
  clients: { claim(): Promise<void> };
}

const scope = self as unknown as WorkerScope;
const CACHE = 'shedwright-app-v1';
const SHELL = '/index.html';

scope.addEventListener('install', (event) => {
  event.waitUntil(caches.open(CACHE).then((cache) => cache.add(SHELL)).then(() => scope.skipWaiting()));
});

scope.addEventListener('activate', (event) => {
  event.waitUntil(scope.clients.claim());
});

scope.addEventListener('fetch', (event) => {
  const { request } = event;
  const url = new URL(request.url);
  if (request.method !== 'GET' || url.origin !== location.origin || url.pathname.startsWith('/api/')) return;
  // Network first, so a new build is picked up at once; the cached copy only when the network fails.
  event.respondWith(
    fetch(request)
      .then((response) => {
        if (response.ok) {
          const copy = response.clone();
          void caches.open(CACHE).then((cache) => cache.put(request.mode === 'navigate' ? SHELL : request, copy));
        }
        return response;
      })
      .catch(async () => {
        const cached = await caches.match(request.mode === 'navigate' ? SHELL : request);
        return cached ?? Response.error();
      }),
  );
});
