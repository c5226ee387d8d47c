import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';
import './index.css';

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');
createRoot(root).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);

// Takes an earlier visit could not send go out now (and whenever the connection returns); the
// queue's code loads after the first paint, so the first page does not wait for it.
void import('./lib/take-queue').then((m) => m.startTakeSync());
