import { Component, type ErrorInfo, type ReactNode } from 'react';

interface Props {
  fallback: (error: unknown, reset: () => void) => ReactNode;
  children: ReactNode;
}

/**
 * Catches a render error in its subtree and shows the fallback instead of a blank page.
 * (React still offers error boundaries only as class components.)
 */
export class ErrorBoundary extends Component<Props, { error: unknown }> {
  state: { error: unknown } = { error: null };

  static getDerivedStateFromError(error: unknown) {
    return { error };
  }

  componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error('Edgeledger: a page failed to render', error, info.componentStack);
  }

  reset = () => this.setState({ error: null });

  render() {
    if (this.state.error) return this.props.fallback(this.state.error, this.reset);
    return this.props.children;
  }
}
