import '@fontsource/lato/400.css';
import '@fontsource/lato/700.css';
import '@fontsource/lato/400-italic.css';
import './styles/index.css';
import { installPlainWords } from '@shared/contracts/plain-words';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/app';

// Every form and every parsed answer speaks the same plain sentences (shared/contracts/plain-words.ts).
installPlainWords();

const rootElement = document.getElementById('root');
if (!rootElement) throw new Error('index.html has no #root element');

createRoot(rootElement).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
