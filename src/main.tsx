import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
// Only the Literata faces the pages use: latin text at 400 and 600, and 400 italic.
import '@fontsource/literata/latin-400.css';
import '@fontsource/literata/latin-600.css';
import '@fontsource/literata/latin-400-italic.css';
import './styles/index.css';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');

createRoot(root).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
