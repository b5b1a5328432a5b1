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

createRoot(container).render(
  <StrictMode>
    <AppProviders />
  </StrictMode>,
);
