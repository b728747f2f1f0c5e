import { ApiError } from "../api/client";
import { Button } from "./ui/button";
import { StatusNote } from "./ui/status-note";

/**
 * A computation the server could not do just now (it failed, or could not be reached): said as
 * such, never as a fault in the person's inputs, with the last good result kept on screen and a
 * way to ask again.
 */
export function ServerTrouble({ error, what, kept, onRetry }: { error: unknown; what: string; kept: boolean; onRetry?: () => void }) {
  const reason = error instanceof ApiError ? error.message : "The request did not complete.";
  return (
    <StatusNote tone="caution" word="Not worked out" className="items-center">
      <p data-testid="server-trouble">
        The server could not work out {what} just now ({reason.replace(/\.$/, "")}). Your inputs are not the problem.
        {kept ? " What is shown is still from the last values that worked." : ""}
      </p>
      {onRetry && (
        <Button variant="secondary" className="mt-2 min-h-9" onClick={onRetry}>
          Try again
        </Button>
      )}
    </StatusNote>
  );
}
