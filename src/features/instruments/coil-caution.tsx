import { StatusNote } from "../../components/ui/status-note";

/** Where test fields are made (Helmholtz sets and the sources that drive them): who keeps clear, and whose rules apply. */
export function CoilCaution({ className = "" }: { className?: string }) {
  return (
    <StatusNote tone="caution" word="Test coils" className={className}>
      People with pacemakers or other implants keep out of the test area while the coils are energised. ICNIRP (2010) reference levels at 50/60 Hz: 1 mT
      for workers, 0.2 mT for the public. Follow your site&apos;s rules and local regulations, which come first.
    </StatusNote>
  );
}
