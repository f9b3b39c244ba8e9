import { THEME_CHOICES, type ThemeChoice, useSekundoStore } from '../store';

const LABELS: Readonly<Record<ThemeChoice, string>> = { light: 'Light', dark: 'Dark', system: 'System' };

/** Light, dark or the system's setting: three radio buttons (arrow keys move between them). */
export function ThemeToggle() {
  const choice = useSekundoStore((s) => s.themeChoice);
  const setChoice = useSekundoStore((s) => s.setThemeChoice);
  return (
    <fieldset className="header-segmented">
      <legend className="visually-hidden">Colour theme</legend>
      <span className="header-segmented__label" aria-hidden="true">
        Theme
      </span>
      {THEME_CHOICES.map((c) => (
        <label key={c} className="header-segmented__option">
          <input className="header-segmented__input" type="radio" name="sekundo-theme" value={c} checked={choice === c} onChange={() => setChoice(c)} />
          {LABELS[c]}
        </label>
      ))}
    </fieldset>
  );
}
