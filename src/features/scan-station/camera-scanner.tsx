import { useEffect, useRef, useState } from "react";
import { StatusNote } from "../../components/ui/status-note";

/** Whether this browser may offer the camera at all (a secure page with media devices). */
export const cameraPossible = () => typeof navigator !== "undefined" && Boolean(navigator.mediaDevices?.getUserMedia) && window.isSecureContext;

/**
 * Reads Code 128 and Data Matrix codes from the device camera (ZXing, loaded only when asked for).
 * Each code read is handed on once; the same code again needs a pause of two seconds, so holding a
 * traveler in view does not scan it over and over.
 */
export function CameraScanner({ onCode }: { onCode: (text: string) => void }) {
  const video = useRef<HTMLVideoElement>(null);
  const handler = useRef(onCode);
  handler.current = onCode;
  const [problem, setProblem] = useState<string | null>(null);

  useEffect(() => {
    let stop: (() => void) | null = null;
    let cancelled = false;
    let last = { text: "", at: 0 };
    void (async () => {
      try {
        const { BrowserMultiFormatReader } = await import("@zxing/browser");
        if (cancelled || !video.current) return;
        const reader = new BrowserMultiFormatReader();
        const controls = await reader.decodeFromVideoDevice(undefined, video.current, (result) => {
          if (!result) return;
          const text = result.getText();
          const now = Date.now();
          if (text === last.text && now - last.at < 2000) return;
          last = { text, at: now };
          handler.current(text);
        });
        if (cancelled) controls.stop();
        else stop = () => controls.stop();
      } catch (error) {
        setProblem(error instanceof Error && error.name === "NotAllowedError" ? "The camera was not allowed. Allow it in the browser's site settings, or use the scanner or the keyboard." : "No camera could be opened on this device. Use the scanner or the keyboard.");
      }
    })();
    return () => {
      cancelled = true;
      stop?.();
    };
  }, []);

  return (
    <div className="space-y-2">
      {problem ? (
        <StatusNote tone="caution">{problem}</StatusNote>
      ) : (
        <video ref={video} className="aspect-video w-full max-w-xl rounded-lg bg-flux-950" muted playsInline aria-label="Camera view for reading barcodes" />
      )}
    </div>
  );
}
