import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
// The typeface ships with the app: only the Latin subsets and the three weights in use.
import '@fontsource/ibm-plex-sans/latin-400.css';
import '@fontsource/ibm-plex-sans/latin-500.css';
import '@fontsource/ibm-plex-sans/latin-600.css';
import './index.css';
import { App } from './app';

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');
createRoot(root).render(
  <StrictMode>
    <App />
  </StrictMode>,
);

// Built app only: the dev server's modules change too often to cache.
if (import.meta.env.PROD && 'serviceWorker' in navigator) {
  void navigator.serviceWorker.register('/service-worker.js').catch(() => {
    // Without it the app still works online; only reloading while offline is lost.
  });
}
