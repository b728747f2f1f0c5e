import { ApiError } from "../api/client";
import { Button } from "./ui/button";
import { StatusNote } from "./ui/status-note";

/** The error state of a panel whose query failed: says what happened and offers a retry. */
export function QueryError({ error, onRetry, what = "this information" }: { error: unknown; onRetry?: () => void; what?: string }) {
  const message = error instanceof ApiError ? error.message : "Something went wrong.";
  return (
    <div className="space-y-3">
      <StatusNote tone="danger" word="Could not load">
        {what}. {message}
      </StatusNote>
      {onRetry && (
        <Button variant="secondary" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}
