/// <reference types="vite-plugin-pwa/client" />
import { registerSW } from 'virtual:pwa-register';

/**
 * Install the service worker that keeps the app shell for offline use. New versions take over
 * on their own (autoUpdate); nothing a person typed is at risk because drafts live in IndexedDB.
 */
export function registerServiceWorker() {
  if (!('serviceWorker' in navigator)) return;
  registerSW({
    immediate: true,
    onRegisterError: (error: unknown) => console.warn('offline support unavailable', error),
  });
}
