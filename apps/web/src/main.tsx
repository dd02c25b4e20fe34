import '@fontsource/open-sans/400.css';
import '@fontsource/open-sans/600.css';
import '@fontsource/open-sans/700.css';
import './app/global.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { refreshSession } from './api/client';
import { session } from './api/session';
import { App } from './app/App';

// Restore the session from the refresh cookie while the app renders; routes wait for the answer.
void refreshSession().then((restored) => {
  if (!restored) session.signedOut();
});

const container = document.getElementById('root');
if (!container) throw new Error('The page has no #root element.');

createRoot(container).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
