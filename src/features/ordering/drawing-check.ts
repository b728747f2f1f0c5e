// What the browser can say of a chosen drawing before sending it; the server decides again, by content.
import { drawingKinds, MAX_DRAWING_BYTES } from "../../../shared/schemas/order";

const extensions: string[] = Object.values(drawingKinds).flatMap((k) => [...k.extensions]);
export const fileSize = (bytes: number) => (bytes >= 1024 * 1024 ? `${(bytes / 1024 / 1024).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} kB`);

/**
 * What is wrong with a chosen drawing before it is sent (the server decides again, by content):
 * empty, too big, or not a kind the shop reads.
 */
export function drawingProblem(file: Pick<File, "name" | "size">): string | null {
  const ext = file.name.toLowerCase().split(".").pop() ?? "";
  if (!file.name.includes(".") || !extensions.includes(ext)) return `${file.name}: send PDF, DXF, STEP or an image (PNG, JPEG, TIFF, WebP).`;
  if (file.size === 0) return `${file.name} is empty.`;
  if (file.size > MAX_DRAWING_BYTES) return `${file.name} is ${fileSize(file.size)}; at most ${fileSize(MAX_DRAWING_BYTES)} a file.`;
  return null;
}

