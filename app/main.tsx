import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { startPreferences } from '../src/ui/preferences/persist-preferences';
import { registerOfflineCache } from './offline/register';
import './styles.css';

// Theme, display units and the tour's state as the browser kept them, before the first paint.
startPreferences();

const container = document.getElementById('root');
if (!container) throw new Error('Sekundo: the page has no #root element.');

createRoot(container).render(
  <StrictMode>
    <App />
  </StrictMode>,
);

registerOfflineCache();
