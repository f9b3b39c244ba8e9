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

/**
 * Sekundo's mark: a square heater pulse and, later along the baseline, its second-sound copy,
 * smaller and rounded by the journey through the liquid. Decorative; public/favicon.svg and the
 * app icons draw the same shape.
 */
function SekundoMark() {
  return (
    <svg className="app-mark" viewBox="0 0 40 40" width="40" height="40" aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="38" height="38" rx="9" className="app-mark__tile" />
      <path d="M4.5 28H8.5V12H13.5V28H16" className="app-mark__heater" />
      <path d="M16 28H20C23.2 28 23.6 18.5 27.25 18.5S31.3 28 34.5 28H35.5" className="app-mark__arrival" />
    </svg>
  );
}
