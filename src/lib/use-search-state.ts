import { useCallback, useEffect, useRef, useState } from "react";
import { useLocation, useNavigate } from "react-router-dom";

/** How an edit reached the state: keystrokes in a box, or a finished step (a choice, a button, a box left). */
export type EditKind = "typing" | "commit";

/**
 * Page state that lives in the address bar, so reload keeps it and a link shares it.
 *
 * History: a finished step (a choice from a list, a button, leaving a box after typing in it)
 * is one entry, so Back undoes one step; the keystrokes of one box are not each an entry — the
 * first keystroke after a finished step pushes a new entry and the rest replace it as they come.
 * Back and forward (or any link to the page) load the state from the address bar.
 *
 * `write` must give equal strings for equal states, `read` must accept anything (old or
 * hand-edited links) and fall back to defaults.
 */
export function useSearchState<T>(read: (search: URLSearchParams) => T, write: (state: T) => URLSearchParams) {
  const location = useLocation();
  const navigate = useNavigate();
  const [state, setState] = useState<T>(() => read(new URLSearchParams(location.search)));
  const written = useRef<string>(write(state).toString());
  const pushNext = useRef(true);
  // Addresses this hook navigated to that the router has not shown yet. A navigation lands after
  // the route's loaders, so on a slow machine an earlier edit's address can arrive after a later
  // edit was made: it is ours and old, not Back, and must not roll the state back to it.
  const inFlight = useRef<string[]>([]);
  const navigateTo = useCallback(
    (search: string, replace: boolean) => {
      inFlight.current.push(search);
      if (inFlight.current.length > 100) inFlight.current.shift();
      navigate({ search }, { replace, preventScrollReset: true });
    },
    [navigate],
  );

  // The address bar always holds the whole state, from the first render on (a bare /page link too).
  useEffect(() => {
    if (location.search.replace(/^\?/, "") !== written.current) navigateTo(written.current, true);
    // once, on arrival: later changes go through `update`
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  // Back, forward or a link changed the address: that is the state now.
  useEffect(() => {
    const search = location.search.replace(/^\?/, "");
    const ours = inFlight.current.indexOf(search);
    if (ours >= 0) {
      inFlight.current.splice(0, ours + 1); // this one and any older of ours have landed
      return;
    }
    if (search === written.current) return;
    const next = read(new URLSearchParams(search));
    const normal = write(next).toString();
    if (normal === written.current) return; // the same state written another way
    written.current = normal;
    pushNext.current = true;
    setState(next);
  }, [location.search, read, write]);

  const update = useCallback(
    (next: T, kind: EditKind = "commit") => {
      setState(next);
      const search = write(next).toString();
      if (search === written.current) return;
      written.current = search;
      const replace = kind === "typing" && !pushNext.current;
      pushNext.current = kind === "commit";
      navigateTo(search, replace);
    },
    [navigateTo, write],
  );

  /** The person finished an edit (left the box): the next keystroke starts a new history entry. */
  const commit = useCallback(() => {
    pushNext.current = true;
  }, []);

  return [state, update, commit] as const;
}
