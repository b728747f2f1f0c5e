import { Component, type ErrorInfo, type ReactNode } from "react";
import { useQueryErrorResetBoundary } from "@tanstack/react-query";
import { Button } from "./ui/button";
import { StatusNote } from "./ui/status-note";

interface BoundaryProps {
  /** Names the panel in the fallback ("Could not show the user list"). */
  name: string;
  children: ReactNode;
  onReset?: () => void;
}

interface BoundaryState {
  error: Error | null;
}

/** Catches a render error in one panel so the rest of the page stays usable. */
export class ErrorBoundary extends Component<BoundaryProps, BoundaryState> {
  state: BoundaryState = { error: null };

  static getDerivedStateFromError(error: Error): BoundaryState {
    return { error };
  }

  componentDidCatch(error: Error, info: ErrorInfo): void {
    console.error(`Panel "${this.props.name}" failed`, error, info.componentStack);
  }

  private reset = () => {
    this.props.onReset?.();
    this.setState({ error: null });
  };

  render() {
    if (!this.state.error) return this.props.children;
    return (
      <section className="space-y-3 rounded-lg border border-danger-200 bg-white p-5">
        <StatusNote tone="danger" word="Could not show" live="assertive">
          {this.props.name}. The rest of the page still works.
        </StatusNote>
        <Button variant="secondary" onClick={this.reset}>
          Try again
        </Button>
      </section>
    );
  }
}

/** ErrorBoundary that also clears failed queries inside it when the user retries. */
export function PanelBoundary({ name, children }: { name: string; children: ReactNode }) {
  const { reset } = useQueryErrorResetBoundary();
  return (
    <ErrorBoundary name={name} onReset={reset}>
      {children}
    </ErrorBoundary>
  );
}
