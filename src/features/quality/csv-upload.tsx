import { useState, type FormEvent } from "react";
import { blamesInputs, type ApiError } from "../../api/client";
import { useUploadReadings } from "../../api/quality";
import { Button } from "../../components/ui/button";
import { StatusNote } from "../../components/ui/status-note";
import { csvColumns } from "../../../shared/schemas/quality";

/** Many readings at once: the file is checked row by row and stored whole or not at all. */
export function CsvUpload({ lotId }: { lotId: string }) {
  const [file, setFile] = useState<File | null>(null);
  const upload = useUploadReadings(lotId);
  const error = upload.error as ApiError | null;
  const rows = error && blamesInputs(error) ? Object.entries(error.fields ?? {}) : [];
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (file) upload.mutate(file);
  };
  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Upload readings">
      <p className="text-meta text-flux-700">
        A CSV with a header row: <code className="font-mono break-all">{csvColumns.join(",")}</code> (the last two optional). Fields may carry their unit: 100 uT, 0.1 mT, 1 G, 5 mG, 80 A/m; a bare number is µT. The instrument is named as in the register.
      </p>
      <label className="block font-semibold text-flux-900" htmlFor="readings-file">File of readings</label>
      <input id="readings-file" type="file" accept=".csv,text/csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="block text-body" />
      <Button type="submit" variant="secondary" pending={upload.isPending} pendingLabel="Checking…" disabled={!file}>Upload readings</Button>
      {upload.data && !error && <StatusNote tone="ok" live="polite" word="Stored">{upload.data.stored} readings stored.</StatusNote>}
      {error && (
        <StatusNote tone="danger" live="assertive">
          {error.message}
          {rows.length > 0 && (
            <ul className="mt-2 list-disc pl-5" data-testid="csv-problems">
              {rows.map(([k, v]) => (
                <li key={k}>
                  {k.replace(/^rows\.(\d+)\./, "row $1, ")}: {v}
                </li>
              ))}
            </ul>
          )}
        </StatusNote>
      )}
    </form>
  );
}
