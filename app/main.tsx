import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { registerOfflineCache } from './offline/register';
import './styles.css';

const container = document.getElementById('root');
if (!container) throw new Error('Sekundo: the page has no #root element.');

createRoot(container).render(
  <StrictMode>
    <App />
  </StrictMode>,
);

registerOfflineCache();
