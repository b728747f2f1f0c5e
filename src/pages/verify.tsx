import { useQuery } from "@tanstack/react-query";
import { sha256 } from "@noble/hashes/sha2";
import { bytesToHex } from "@noble/hashes/utils";
import { useState, type DragEvent, type FormEvent } from "react";
import { Link, useNavigate, useParams } from "react-router-dom";
import { ApiError } from "../api/client";
import { verifyFileHash, verifyQueryOptions, type CertificateVerificationJson } from "../api/quality";
import { Button } from "../components/ui/button";
import { ResponsiveTable, type Column } from "../components/ui/responsive-table";
import { TextField } from "../components/ui/field";
import { PageHeader, Panel } from "../components/ui/panel";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { paths } from "../config/paths";
import { certificateDigest, type CanonicalValue } from "../../shared/quality/digest";

// Public: anyone holding a certificate checks it here, by the digest printed on it (or its QR
// code), or by dropping the PDF itself. No sign-in.

type MeasuredPart = CertificateVerificationJson["content"]["measurements"][number] & { row: number };

const fixed = (x: number, digits: number) => x.toLocaleString("en-GB", { minimumFractionDigits: digits, maximumFractionDigits: digits });

const partColumns: Column<MeasuredPart>[] = [
  { key: "serial", header: "Serial", cell: (m) => m.serial, primary: true },
  { key: "field", header: "Applied field", cell: (m) => `${fixed(m.appliedField_uT, 1)} µT at ${fixed(m.frequency_hz, 0)} Hz`, align: "end" },
  { key: "inside", header: "Inside", cell: (m) => `${fixed(m.insideField_uT, 3)} µT`, align: "end" },
  { key: "where", header: "Orientation, probe", cell: (m) => `${m.orientation}, ${m.probePosition}` },
  { key: "s", header: "Shielding factor", cell: (m) => fixed(m.shieldingFactor, 0), align: "end" },
  { key: "db", header: "Attenuation", cell: (m) => `${fixed(m.attenuation_db, 1)} dB`, align: "end" },
  { key: "pass", header: "Against the order", cell: (m) => (m.pass ? "Pass" : "Fail") },
];

/** What the certificate certifies beyond its summary: the material's heats, the route, the instruments and every measured part. */
function CertifiedDetail({ c }: { c: CertificateVerificationJson["content"] }) {
  return (
    <div className="space-y-4">
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
        <div><dt className="text-meta text-flux-600">Heats</dt><dd>{c.material.heats.length ? c.material.heats.map((h) => `${h.heatNumber} (${h.supplier})`).join("; ") : "—"}</dd></div>
        <div><dt className="text-meta text-flux-600">Forming route</dt><dd>{c.formingRoute.join(" → ") || "—"}</dd></div>
        <div><dt className="text-meta text-flux-600">Instruments</dt><dd>{c.instruments.map((i) => `${i.name} (${i.serialNumber}, calibrated ${i.lastCalibratedOn}, due ${i.calibrationDue})`).join("; ") || "—"}</dd></div>
        <div><dt className="text-meta text-flux-600">Predicted for the design</dt><dd>{c.predicted_db === null ? "—" : `${fixed(c.predicted_db, 1)} dB (an estimate, for comparison)`}</dd></div>
      </dl>
      <ResponsiveTable caption={`The ${c.measurements.length} measured parts`} columns={partColumns} rows={c.measurements.map((m, row) => ({ ...m, row }))} rowKey={(m) => String(m.row)} testId="certified-parts" rowTestId="certified-part" />
      <p className="text-meta text-flux-700">{c.statement}</p>
    </div>
  );
}

function Verdict({ v }: { v: CertificateVerificationJson }) {
  const c = v.content;
  const recomputed = certificateDigest(c as unknown as CanonicalValue) === v.digest;
  return (
    <div className="space-y-4" data-testid="verification">
      {v.current ? (
        <StatusNote tone="ok" word="Valid">Certificate {v.number} revision {v.revision} was issued by {c.issuer.name} and is the current revision.</StatusNote>
      ) : (
        <StatusNote tone="caution" word="Superseded">
          Certificate {v.number} revision {v.revision} was issued by {c.issuer.name} but is superseded by revision {v.supersededBy!.revision} ({v.supersededBy!.issuedAt.slice(0, 10)}).{" "}
          <Link className="underline" to={paths.verify.href(v.supersededBy!.digest)}>See the current revision</Link>
        </StatusNote>
      )}
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
        {([
          ["Customer", c.customer.organization],
          ["Order", `${c.order.number}${c.order.purchaseOrder ? ` (PO ${c.order.purchaseOrder})` : ""}`],
          ["Lot", `${c.lot.number}, ${c.lot.quantity} pieces`],
          ["Part", c.part.description],
          ["Material", c.material.alloy],
          ["Furnace run", c.furnaceRun ? `${c.furnaceRun.number}, peak ${c.furnaceRun.peakTemperature_c} °C, dew point ${c.furnaceRun.dewPoint_c} °C` : "—"],
          ["Sampling plan", `code letter ${c.samplingPlan.codeLetter}, sample ${c.samplingPlan.sampleSize}, Ac ${c.samplingPlan.accept}, Re ${c.samplingPlan.reject}, AQL ${c.samplingPlan.aql}`],
          ["Result", `${c.result.measured} measured, ${c.result.failures} failing: ${c.result.decision}`],
          ["Required", `${c.order.requiredAttenuation_db} dB`],
          ["Signed", `${c.signer.name}, ${c.signer.role}`],
          ["Issued", v.issuedAt.slice(0, 10)],
        ] as const).map(([k, val]) => (
          <div key={k}><dt className="text-meta text-flux-600">{k}</dt><dd>{val}</dd></div>
        ))}
      </dl>
      <CertifiedDetail c={c} />
      <p className="break-all font-mono text-meta">SHA-256 {v.digest}</p>
      <p className="text-meta text-flux-700">
        {recomputed ? "This page recomputed the digest from the content shown, in your browser: it matches." : "The digest recomputed in your browser does not match: do not rely on this certificate."} The
        canonical form: JSON with sorted keys, no spaces, every number with 10 significant digits in exponent form.
      </p>
    </div>
  );
}

export function Component() {
  const { digest } = useParams();
  const navigate = useNavigate();
  const [typed, setTyped] = useState(digest ?? "");
  const [fileResult, setFileResult] = useState<{ name: string; result: CertificateVerificationJson | null; error?: string } | null>(null);
  const [dragging, setDragging] = useState(false);
  const wanted = digest && /^[0-9a-f]{64}$/i.test(digest) ? digest.toLowerCase() : null;
  const check = useQuery({ ...verifyQueryOptions(wanted ?? ""), enabled: !!wanted });

  const checkFile = async (file: File) => {
    const hash = bytesToHex(sha256(new Uint8Array(await file.arrayBuffer())));
    try {
      setFileResult({ name: file.name, result: await verifyFileHash(hash) });
    } catch (e) {
      setFileResult({ name: file.name, result: null, error: e instanceof ApiError && e.status === 404 ? "This file is not a certificate issued here, or it has been changed since it was issued." : "The check could not be made; try again." });
    }
  };
  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setDragging(false);
    const file = e.dataTransfer.files[0];
    if (file) void checkFile(file);
  };
  const submit = (e: FormEvent) => {
    e.preventDefault();
    navigate(paths.verify.href(typed.trim().toLowerCase()));
  };

  return (
    <>
      <PageHeader title="Check a certificate" lead="Certificates of conformance carry a SHA-256 digest of what they certify and a QR code to this page. Anyone can check one here; no account is needed." />
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <Panel title="By its digest">
          <form onSubmit={submit} className="space-y-3">
            <TextField label="Digest (64 characters, printed on the certificate)" value={typed} onChange={(e) => setTyped(e.target.value)} autoComplete="off" spellCheck={false}
              error={digest && !wanted ? "A digest is 64 characters 0–9 and a–f." : undefined} />
            <Button type="submit">Check</Button>
          </form>
        </Panel>
        <Panel title="By the PDF file">
          <div onDragOver={(e) => { e.preventDefault(); setDragging(true); }} onDragLeave={() => setDragging(false)} onDrop={onDrop}
            className={`rounded-lg border-2 border-dashed p-6 text-center ${dragging ? "border-flux-800 bg-anneal-50" : "border-nickel-400"}`} data-testid="drop-zone">
            <p className="mb-3">Drop the certificate PDF here, or choose it:</p>
            <label htmlFor="certificate-file" className="sr-only">Certificate PDF</label>
            <input id="certificate-file" type="file" accept="application/pdf,.pdf" onChange={(e) => { const f = e.target.files?.[0]; if (f) void checkFile(f); }} className="mx-auto block w-full max-w-full" />
            <p className="mt-3 text-meta text-flux-600">The file is hashed in your browser; only its SHA-256 is sent.</p>
          </div>
          {fileResult?.error && <StatusNote tone="danger" live="assertive" word="Not verified">{fileResult.name}: {fileResult.error}</StatusNote>}
          {fileResult?.result && <StatusNote tone="ok" live="polite" word="Same file">{fileResult.name} is exactly the file issued as {fileResult.result.number} revision {fileResult.result.revision}. <Link className="underline" to={paths.verify.href(fileResult.result.digest)}>Show what it certifies</Link></StatusNote>}
        </Panel>
      </div>
      {wanted && (
        <Panel title="Result" className="mt-6">
          {check.isPending && <Loading label="Checking…" />}
          {check.isError && (
            <StatusNote tone="danger" word="Not found">
              {check.error instanceof ApiError && check.error.status === 404 ? "No certificate issued here has this digest: it is not one of ours, or it has been altered." : "The check could not be made; try again."}
            </StatusNote>
          )}
          {check.data && <Verdict v={check.data} />}
        </Panel>
      )}
    </>
  );
}
