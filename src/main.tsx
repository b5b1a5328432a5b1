import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/work-sans/400.css';
import '@fontsource/work-sans/500.css';
import '@fontsource/work-sans/600.css';
import '@fontsource/work-sans/700.css';
import './styles.css';
import { AppProviders } from '@/app/providers';

const container = document.getElementById('root');
if (!container) throw new Error('index.html is missing the #root element');

// The offline shell (dist/sw.js, built by vite.config.ts); the queue of entries lives in the pages' own chunks.
if (import.meta.env.PROD) void navigator.serviceWorker?.register('/sw.js');

createRoot(container).render(
  <StrictMode>
    <AppProviders />
  </StrictMode>,
);
