import { useCallback, useEffect, useRef, useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { ApiError } from "../../api/client";
import { rememberJob } from "../../api/jobs";
import { postScan, type KeyedScan, type ScanJson } from "../../api/scans";
import { enqueueScan, isUnreachable, queuedScans, replayQueue, type QueuedScan, type ReplayOutcome } from "./scan-queue";

/** What the station tells the operator about the last scan. */
export type Feedback =
  | { kind: "recorded"; answer: ScanJson; replayed?: boolean }
  | { kind: "repeat"; answer: ScanJson; replayed?: boolean }
  | { kind: "refused"; scan: KeyedScan; error: ApiError; replayed?: boolean }
  | { kind: "queued"; scan: KeyedScan };

const RETRY_MS = 10_000;

/**
 * The station's sending: a scan goes straight to the server when the device is online and nothing
 * older is waiting; otherwise it joins the queue, which is sent in order when the network returns
 * (the browser's "online" event, and a retry every few seconds while anything waits).
 */
export function useScanQueue(onFeedback: (f: Feedback) => void) {
  const queryClient = useQueryClient();
  const [queue, setQueue] = useState<QueuedScan[]>([]);
  const [online, setOnline] = useState(() => navigator.onLine);
  const [sending, setSending] = useState(false);
  const busy = useRef(false);
  const feedback = useRef(onFeedback);
  feedback.current = onFeedback;

  const reload = useCallback(async () => setQueue(await queuedScans()), []);

  const answered = useCallback(
    (answer: ScanJson, replayed = false) => {
      rememberJob(queryClient, answer.job);
      feedback.current({ kind: answer.repeat ? "repeat" : "recorded", answer, replayed });
    },
    [queryClient],
  );

  const replay = useCallback(async () => {
    if (busy.current) return;
    busy.current = true;
    setSending(true);
    try {
      await replayQueue((outcome: ReplayOutcome) => {
        if ("answer" in outcome) answered(outcome.answer, true);
        else feedback.current({ kind: "refused", scan: outcome.scan, error: outcome.refused, replayed: true });
      });
    } finally {
      busy.current = false;
      setSending(false);
      await reload();
    }
  }, [answered, reload]);

  useEffect(() => {
    void reload().then(() => replay());
    const up = () => {
      setOnline(true);
      void replay();
    };
    const down = () => setOnline(false);
    window.addEventListener("online", up);
    window.addEventListener("offline", down);
    return () => {
      window.removeEventListener("online", up);
      window.removeEventListener("offline", down);
    };
  }, [reload, replay]);

  // while anything waits, keep trying (the "online" event is not the only sign the server is back)
  useEffect(() => {
    if (!queue.length) return;
    const timer = window.setInterval(() => void replay(), RETRY_MS);
    return () => window.clearInterval(timer);
  }, [queue.length, replay]);

  const submit = useCallback(
    async (made: KeyedScan) => {
      // stamped once: a scan sent, lost on the way and queued is the same scan under the same key
      const scan = { ...made, scannedAt: made.scannedAt ?? new Date().toISOString() };
      const toQueue = async () => {
        await enqueueScan(scan);
        await reload();
        feedback.current({ kind: "queued", scan });
      };
      // older scans first: a new one never overtakes the queue
      if (!navigator.onLine || (await queuedScans()).length > 0) {
        await toQueue();
        if (navigator.onLine) void replay();
        return;
      }
      try {
        answered(await postScan(scan));
      } catch (error) {
        if (isUnreachable(error)) await toQueue();
        else feedback.current({ kind: "refused", scan, error: error as ApiError });
      }
    },
    [answered, reload, replay],
  );

  return { queue, online, sending, submit, replay };
}
