import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ScanJson, ScanRequest } from "../../shared/schemas/scans";
import { api } from "./client";
import { rememberJob } from "./jobs";

export type { ScanJson, ScanRequest };

/** A scan with the key that makes its replay an exact repeat (the offline queue keeps it with the scan). */
export type KeyedScan = ScanRequest & { idempotencyKey: string };

/** A fresh idempotency key for a scan made on this device. */
export function newScanKey(station: string): string {
  const device = station.replace(/[^A-Za-z0-9._-]/g, "-").slice(0, 40) || "station";
  return `${device}:${crypto.randomUUID()}`;
}

/** Sends one scan: 201 a new event, 200 the event already recorded (both resolve); 409 and 404 reject with the reason in words. */
export const postScan = (scan: KeyedScan) => api.post<ScanJson>("/api/scans", scan);

export function useScan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: postScan,
    onSuccess: (answer) => rememberJob(queryClient, answer.job),
  });
}
