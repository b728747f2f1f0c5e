import { useState } from "react";
import { flatPatternFilename } from "../../../shared/fabrication/filenames";
import type { BlankRequest } from "../../../shared/schemas/blank";
import { ApiError } from "../../api/client";
import { fetchFlatPatternDxf } from "../../api/fabrication";
import { Button } from "../../components/ui/button";

/** Fetches the DXF through the api client and saves it with a Blob link (no page navigation). */
export function DxfDownloadButton({ request, disabled }: { request: BlankRequest; disabled?: boolean }) {
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const download = async () => {
    setPending(true);
    setError(null);
    try {
      const text = await fetchFlatPatternDxf(request);
      const url = URL.createObjectURL(new Blob([text], { type: "application/dxf" }));
      const a = document.createElement("a");
      a.href = url;
      a.download = flatPatternFilename(request);
      document.body.append(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 1000);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The drawing could not be downloaded.");
    } finally {
      setPending(false);
    }
  };
  return (
    <div className="space-y-1">
      <Button variant="secondary" onClick={download} pending={pending} pendingLabel="Preparing DXF…" disabled={disabled}>
        Download DXF for the laser or punch
      </Button>
      {error && <p className="text-meta font-semibold text-danger-700">{error}</p>}
    </div>
  );
}
