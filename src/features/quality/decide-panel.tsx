import { useState, type FormEvent } from "react";
import { blamesInputs, type ApiError } from "../../api/client";
import { useDecideNonconformance } from "../../api/quality";
import { Button } from "../../components/ui/button";
import { SelectField, TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";
import { dispositionLabels, nonconformanceDispositions, type NonconformanceDisposition, type NonconformanceJson } from "../../../shared/schemas/quality";

/** A rejected lot's nonconformance: its cause and what is done with the lot. */
export function NonconformanceForm({ lotId, nc }: { lotId: string; nc: NonconformanceJson }) {
  const [cause, setCause] = useState("");
  const [disposition, setDisposition] = useState<NonconformanceDisposition>("reanneal-retest");
  const [consent, setConsent] = useState("");
  const [asking, setAsking] = useState(false);
  const decide = useDecideNonconformance(lotId);
  const error = decide.error as ApiError | null;
  const fields = error && blamesInputs(error) ? error.fields ?? {} : {};
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!asking) return setAsking(true);
    decide.mutate({ id: nc.id, cause, disposition, ...(disposition === "use-as-is" ? { customerConsent: consent } : {}) }, { onSettled: () => setAsking(false) });
  };
  return (
    <form onSubmit={submit} className="space-y-3" aria-label={`Decide ${nc.number}`}>
      <p className="text-body text-flux-800">{nc.description}</p>
      <TextField label="Cause" value={cause} onChange={(e) => setCause(e.target.value)} error={fields.cause} />
      <SelectField label="Disposition" value={disposition} onChange={(e) => setDisposition(e.target.value as NonconformanceDisposition)} error={fields.disposition}>
        {nonconformanceDispositions.map((d) => (
          <option key={d} value={d}>{dispositionLabels[d]}</option>
        ))}
      </SelectField>
      {disposition === "use-as-is" && <TextField label="Customer's written consent (reference)" value={consent} onChange={(e) => setConsent(e.target.value)} error={fields.customerConsent} />}
      {asking && <StatusNote tone="caution" word="Confirm">{dispositionLabels[disposition]} for this lot: this closes {nc.number}. Press the button again to confirm.</StatusNote>}
      <Button type="submit" pending={decide.isPending} pendingLabel="Saving…">{asking ? "Confirm the disposition" : "Record the disposition"}</Button>
      {error && <StatusNote tone="danger" live="assertive">{error.message}</StatusNote>}
    </form>
  );
}
