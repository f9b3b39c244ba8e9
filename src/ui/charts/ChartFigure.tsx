import type { ReactNode } from 'react';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { symbolCase } from '../layout/symbol-case';

interface ChartFigureProps {
  id: string;
  title: string;
  /** What to read from the chart, including the values at the chosen temperature. */
  caption: ReactNode;
  children: ReactNode;
}

/** A chart with its heading and caption; a failing chart leaves the heading and the page in place. */
export function ChartFigure({ id, title, caption, children }: ChartFigureProps) {
  const titleId = `${id}-title`;
  return (
    <figure className="card chart-card" aria-labelledby={titleId}>
      <h3 id={titleId} className="card-title">
        {symbolCase(title)}
      </h3>
      <PanelErrorBoundary panel={`“${title}” chart`}>{children}</PanelErrorBoundary>
      <figcaption className="chart-caption">{caption}</figcaption>
    </figure>
  );
}
