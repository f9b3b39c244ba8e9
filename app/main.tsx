import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { startPreferences } from '../src/ui/preferences/persist-preferences';
import { registerOfflineCache } from './offline/register';
import './styles.css';
import '../src/ui/workspace/workspace.css';
import '../src/ui/converter/watch/watch.css';
import '../src/ui/planner/rehearse/rehearse.css';
import './small-screens.css';
import { startWorkspace } from '../src/ui/workspace/persist-workspace';
import { startLocatePersistence } from '../src/ui/locate/persist-locate';

// Theme, display units and the tour's state as the browser kept them, before the first paint.
startPreferences();
// The plan of the last visit (else the demo opens), named plans, undo history, autosave, a plan link.
startWorkspace();
// The sensors and fit options of the source-location view, as they were left (else the demo opens).
startLocatePersistence();

const container = document.getElementById('root');
if (!container) throw new Error('Sekundo: the page has no #root element.');

createRoot(container).render(
  <StrictMode>
    <App />
  </StrictMode>,
);

registerOfflineCache();
