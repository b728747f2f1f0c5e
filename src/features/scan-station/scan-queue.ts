import { createStore, del, entries, set } from "idb-keyval";
import { ApiError } from "../../api/client";
import { postScan, type KeyedScan, type ScanJson } from "../../api/scans";

// The device's queue of scans not yet answered by the server, kept in IndexedDB so a dropped
// network, a reload or a flat battery loses nothing. Each scan keeps the idempotency key it was
// made with: when the queue is sent again the server answers an exact repeat with the event it
// already holds (200), so a scan is never counted twice.

export interface QueuedScan extends KeyedScan {
  /** order of making on this device (replayed oldest first) */
  seq: number;
  queuedAt: string;
}

const store = () => createStore("fluxwright-scan-station", "queued-scans");

export async function queuedScans(): Promise<QueuedScan[]> {
  const all = await entries<string, QueuedScan>(store());
  return all.map(([, scan]) => scan).sort((a, b) => a.seq - b.seq);
}

export async function enqueueScan(scan: KeyedScan): Promise<QueuedScan> {
  const queued: QueuedScan = { ...scan, seq: Date.now() * 1000 + Math.floor(Math.random() * 1000), queuedAt: new Date().toISOString() };
  await set(queued.idempotencyKey, queued, store());
  return queued;
}

export const dropQueuedScan = (key: string) => del(key, store());

/** The network (or the server) did not answer: the scan stays queued. Anything the server answered is final. */
export function isUnreachable(error: unknown): boolean {
  return !(error instanceof ApiError) || error.status === 0 || error.status >= 500 || error.status === 429;
}

export type ReplayOutcome = { scan: QueuedScan; answer: ScanJson } | { scan: QueuedScan; refused: ApiError };

/**
 * Sends the queue in the order the scans were made. A scan the server answered (recorded, already
 * recorded, or refused with its reason) leaves the queue; at the first unreachable answer the
 * replay stops and the rest wait for the next try, still in order.
 */
export async function replayQueue(onOutcome: (outcome: ReplayOutcome) => void, send: (scan: KeyedScan) => Promise<ScanJson> = postScan): Promise<{ sent: number; left: number }> {
  const queue = await queuedScans();
  let sent = 0;
  for (const scan of queue) {
    const { seq: _seq, queuedAt: _at, ...body } = scan;
    try {
      const answer = await send(body);
      await dropQueuedScan(scan.idempotencyKey);
      onOutcome({ scan, answer });
    } catch (error) {
      if (isUnreachable(error)) return { sent, left: queue.length - sent };
      await dropQueuedScan(scan.idempotencyKey);
      onOutcome({ scan, refused: error as ApiError });
    }
    sent += 1;
  }
  return { sent, left: 0 };
}
