import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { applyLook } from '@baytime/shared';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';
import './styles/base.css';

// The shared palette as CSS custom properties: the style sheets name colours, never copy them.
applyLook(document.documentElement);

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
