/**
 * The colour theme in effect: the person's choice, or the system's light/dark setting when they
 * chose "system". The page sets it as data-theme on <html> (app/styles.css reads it); charts read
 * it through the Plotly wrapper.
 */
import { useEffect, useSyncExternalStore } from 'react';
import { type ThemeChoice, useSekundoStore } from '../store';

export type Theme = 'light' | 'dark';

const DARK_QUERY = '(prefers-color-scheme: dark)';

function darkQuery(): MediaQueryList | null {
  return typeof window !== 'undefined' && typeof window.matchMedia === 'function' ? window.matchMedia(DARK_QUERY) : null;
}

function subscribeToSystem(onChange: () => void): () => void {
  const query = darkQuery();
  if (!query) return () => undefined;
  query.addEventListener('change', onChange);
  return () => query.removeEventListener('change', onChange);
}

/** The operating system's preference (light where it cannot be read). */
export function systemTheme(): Theme {
  return darkQuery()?.matches ? 'dark' : 'light';
}

/** The theme a choice gives now. */
export function resolveTheme(choice: ThemeChoice, system: Theme = systemTheme()): Theme {
  return choice === 'system' ? system : choice;
}

/** The theme in effect, following both the choice and (for "system") the system setting. */
export function useResolvedTheme(): Theme {
  const choice = useSekundoStore((s) => s.themeChoice);
  const system = useSyncExternalStore(subscribeToSystem, systemTheme, () => 'light' as Theme);
  return resolveTheme(choice, system);
}

/** Sets the theme on <html>: data-theme for the styles, data-theme-choice for whoever asks. */
export function setDocumentTheme(theme: Theme, choice: ThemeChoice): void {
  if (typeof document === 'undefined') return;
  const root = document.documentElement;
  root.dataset.theme = theme;
  root.dataset.themeChoice = choice;
}

/** Keeps <html> in step with the theme in effect (mounted once, by the page). */
export function useDocumentTheme(): Theme {
  const theme = useResolvedTheme();
  const choice = useSekundoStore((s) => s.themeChoice);
  useEffect(() => setDocumentTheme(theme, choice), [theme, choice]);
  return theme;
}
