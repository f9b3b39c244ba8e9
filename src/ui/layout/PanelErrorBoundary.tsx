import { Component, type ErrorInfo, type ReactNode } from 'react';

interface PanelErrorBoundaryProps {
  /** Names the panel in the message, e.g. "speeds chart". */
  panel: string;
  children: ReactNode;
}

interface PanelErrorBoundaryState {
  error: Error | null;
}

/** Keeps one failing panel from blanking the page: shows what failed and offers a retry. */
export class PanelErrorBoundary extends Component<PanelErrorBoundaryProps, PanelErrorBoundaryState> {
  override state: PanelErrorBoundaryState = { error: null };

  static getDerivedStateFromError(error: Error): PanelErrorBoundaryState {
    return { error };
  }

  override componentDidCatch(error: Error, info: ErrorInfo): void {
    console.error(`Sekundo: the ${this.props.panel} failed`, error, info.componentStack);
  }

  private readonly retry = (): void => this.setState({ error: null });

  override render(): ReactNode {
    const { error } = this.state;
    if (!error) return this.props.children;
    return (
      <div className="panel-failure" role="alert">
        <p>
          <strong>The {this.props.panel} could not be shown.</strong> {error.message} The rest of Sekundo
          still works.
        </p>
        <button type="button" className="button" onClick={this.retry}>
          Try again
        </button>
      </div>
    );
  }
}
