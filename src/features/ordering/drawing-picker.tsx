import { useId } from "react";
import { DRAWING_ACCEPT, MAX_DRAWING_BYTES, MAX_DRAWINGS_PER_ORDER } from "../../../shared/schemas/order";
import { Button } from "../../components/ui/button";
import { drawingProblem, fileSize } from "./drawing-check";

/** Choose drawings (a button that opens the file chooser), see them listed, remove one before sending. */
export function DrawingPicker({ files, onChange, already = 0, error, label = "Drawings" }: { files: File[]; onChange: (files: File[]) => void; already?: number; error?: string | null; label?: string }) {
  const id = useId();
  const room = MAX_DRAWINGS_PER_ORDER - already;
  return (
    <div className="space-y-2">
      <label htmlFor={id} className="block font-semibold text-flux-900">
        {label}
      </label>
      <p id={`${id}-hint`} className="text-meta text-flux-600">
        PDF, DXF, STEP or images, at most {fileSize(MAX_DRAWING_BYTES)} each and {MAX_DRAWINGS_PER_ORDER} per order{already ? ` (${already} attached already)` : ""}.
      </p>
      <input
        id={id}
        type="file"
        multiple
        accept={DRAWING_ACCEPT}
        aria-describedby={`${id}-hint`}
        className="block w-full text-body file:mr-3 file:min-h-touch file:rounded-md file:border file:border-flux-300 file:bg-white file:px-4 file:font-semibold file:text-flux-800"
        onChange={(e) => {
          const chosen = Array.from(e.target.files ?? []);
          e.target.value = ""; // the same file can be chosen again after removing it
          onChange([...files, ...chosen].slice(0, Math.max(0, room)));
        }}
      />
      {files.length > 0 && (
        <ul className="space-y-1" aria-label="Drawings to send">
          {files.map((f, i) => {
            const problem = drawingProblem(f);
            return (
              <li key={`${f.name}-${i}`} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-nickel-200 px-3 py-1.5">
                <span className="min-w-0 break-all">
                  {f.name} <span className="font-mono text-meta text-flux-600">{fileSize(f.size)}</span>
                  {problem && <span className="block text-meta font-semibold text-danger-700">{problem}</span>}
                </span>
                <Button variant="quiet" className="min-h-9 px-2 text-meta" aria-label={`Remove ${f.name}`} onClick={() => onChange(files.filter((_, j) => j !== i))}>
                  Remove
                </Button>
              </li>
            );
          })}
        </ul>
      )}
      {error && (
        <p role="alert" className="text-meta font-semibold text-danger-700">
          {error}
        </p>
      )}
    </div>
  );
}
