import { StrictMode } from 'react';
import { createRoot, hydrateRoot } from 'react-dom/client';
import { AppProvider, startOfflineOnce } from '@/app/provider';
import { AppRouter, routerReady } from '@/app/router';
import './index.css';

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element.');

const app = (
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>
);

if (container.firstElementChild) {
  // The page's markup came with the HTML (sign-in.html, apps/web/src/app/prerender.tsx): it is hydrated once the
  // first render would match it, with the phone's saved data back and the route's chunk loaded, so it never
  // flashes a spinner and what was typed before the scripts arrived stays in the fields.
  void Promise.all([startOfflineOnce(), routerReady()]).then(() => hydrateRoot(container, app));
} else {
  createRoot(container).render(app);
}
