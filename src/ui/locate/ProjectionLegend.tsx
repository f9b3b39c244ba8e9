import type { ReactNode } from 'react';
import { themedColour } from '../plot/plot-theme';
import { useResolvedTheme } from '../theme/use-theme';
import { LOCATE_COLOURS as WRITTEN_COLOURS, TRACE_NAMES } from './locate-figures';

/** Which entries the projections show now. */
export interface LegendPresence {
  sensors: boolean;
  outliers: boolean;
  dropped: boolean;
  noArrival: boolean;
  source: boolean;
  regions: boolean;
  surface: boolean;
}

const S = 14;

function Icon({ children }: { children: ReactNode }) {
  return (
    <svg width={S} height={S} viewBox="0 0 14 14" aria-hidden="true" className="locate-legend__icon">
      {children}
    </svg>
  );
}

const cross = (colour: string, open: boolean) => (
  <Icon>
    <path d="M3 3 L11 11 M11 3 L3 11" stroke={colour} strokeWidth={open ? 1.5 : 3} strokeLinecap="round" fill="none" />
  </Icon>
);

/** One legend for both projections: symbol and words for every kind of mark on them. */
export function ProjectionLegend({ present }: { present: LegendPresence }) {
  // The same colours as the charts beside it, in the page's theme.
  const theme = useResolvedTheme();
  const LOCATE_COLOURS = Object.fromEntries(Object.entries(WRITTEN_COLOURS).map(([k, c]) => [k, themedColour(c, theme)])) as Record<keyof typeof WRITTEN_COLOURS, string>;
  const entries: { key: string; show: boolean; icon: ReactNode; text: string }[] = [
    {
      key: 'sensors',
      show: present.sensors,
      icon: (
        <Icon>
          <circle cx="7" cy="7" r="4.5" fill={LOCATE_COLOURS.sensor} />
        </Icon>
      ),
      text: 'sensor, fitted',
    },
    { key: 'outliers', show: present.outliers, icon: cross(LOCATE_COLOURS.outlier, false), text: 'outlier (beyond 3σ), kept' },
    { key: 'dropped', show: present.dropped, icon: cross(LOCATE_COLOURS.outlier, true), text: `outlier, ${TRACE_NAMES.dropped}` },
    {
      key: 'noArrival',
      show: present.noArrival,
      icon: (
        <Icon>
          <circle cx="7" cy="7" r="4.5" fill="none" stroke={LOCATE_COLOURS.sensor} strokeWidth="1.5" />
        </Icon>
      ),
      text: 'sensor without a reading',
    },
    {
      key: 'source',
      show: present.source,
      icon: (
        <Icon>
          <path d="M7 1 L8.7 5.2 L13 5.5 L9.7 8.3 L10.7 12.8 L7 10.4 L3.3 12.8 L4.3 8.3 L1 5.5 L5.3 5.2 Z" fill={LOCATE_COLOURS.source} />
        </Icon>
      ),
      text: 'located source',
    },
    {
      key: 'sigma1',
      show: present.regions,
      icon: (
        <Icon>
          <ellipse cx="7" cy="7" rx="6" ry="4" fill={LOCATE_COLOURS.sigma1Fill} stroke={LOCATE_COLOURS.source} strokeWidth="1.8" />
        </Icon>
      ),
      text: '1σ region (68.3 %)',
    },
    {
      key: 'sigma2',
      show: present.regions,
      icon: (
        <Icon>
          <ellipse cx="7" cy="7" rx="6" ry="4" fill="none" stroke={LOCATE_COLOURS.source} strokeWidth="1.5" strokeDasharray="3 2" />
        </Icon>
      ),
      text: '2σ region (95.4 %)',
    },
    {
      key: 'surface',
      show: present.surface,
      icon: (
        <Icon>
          <path d="M1 7 L13 7" stroke={LOCATE_COLOURS.surface} strokeWidth="1.5" strokeDasharray="1.5 2" />
        </Icon>
      ),
      text: 'surface the source is held on',
    },
  ];
  return (
    <ul className="locate-legend" aria-label="Legend of the projections">
      {entries
        .filter((e) => e.show)
        .map((e) => (
          <li key={e.key}>
            {e.icon}
            {e.text}
          </li>
        ))}
    </ul>
  );
}
