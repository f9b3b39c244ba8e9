import { ThemeToggle } from '../theme/ThemeToggle';
import { UnitsSettings } from '../units/UnitsSettings';

/** Product name, what it is for, the mark; the theme and the display units. */
export function AppHeader() {
  return (
    <header className="app-header">
      <div className="app-header__inner">
        <SekundoMark />
        <div className="app-header__title">
          <h1 className="app-title">Sekundo</h1>
          <p className="app-tagline">Second-sound time-of-flight planning and thermometry for superfluid helium-4 (He II)</p>
        </div>
        <div className="app-header__controls">
          <ThemeToggle />
          <UnitsSettings />
        </div>
      </div>
    </header>
  );
}

/** A heat pulse crossing a cell: the mark beside the name. Decorative. */
function SekundoMark() {
  return (
    <svg className="app-mark" viewBox="0 0 40 40" width="40" height="40" aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="38" height="38" rx="9" className="app-mark__tile" />
      <path d="M6 26 H13 L16 12 L19 30 L22 18 L24 26 H34" className="app-mark__pulse" />
      <circle cx="34" cy="26" r="2.4" className="app-mark__dot" />
    </svg>
  );
}
