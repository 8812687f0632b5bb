import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/600.css';
import '@fontsource/source-sans-3/700.css';
import './styles/index.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { AppProvider } from './app/provider';
import { AppRouter, startPage } from './app/router';
import { meQueryOptions } from './features/auth/api/get-me';
import { cartQueryOptions } from './features/cart/api/get-cart';
import { queryClient } from './lib/query-client';

// The header's two requests leave now, beside the page's code and data, rather than after the page has rendered.
void queryClient.prefetchQuery(meQueryOptions());
void queryClient.prefetchQuery(cartQueryOptions());
// And the page's own code and first request, before React renders anything.
startPage(window.location);

const root = document.getElementById('root');
if (!root) throw new Error('No #root element');
createRoot(root).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
