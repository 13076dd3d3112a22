import { Component, type ReactNode } from 'react';
import { Alert } from './feedback';

/** Keeps a failing panel from taking the whole page down. */
export class PanelErrorBoundary extends Component<
  { children: ReactNode; title?: string },
  { error: Error | null }
> {
  state = { error: null as Error | null };
  static getDerivedStateFromError(error: Error) {
    return { error };
  }
  render() {
    if (this.state.error) {
      return (
        <Alert tone="danger" title={this.props.title ?? 'This panel could not be shown'}>
          {this.state.error.message}
        </Alert>
      );
    }
    return this.props.children;
  }
}

export function ErrorText({ error }: { error: unknown }) {
  if (!error) return null;
  return (
    <Alert tone="danger">{error instanceof Error ? error.message : 'Something went wrong.'}</Alert>
  );
}
