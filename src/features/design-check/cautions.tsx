import { StatusNote } from "../../components/ui/status-note";

/** What a prediction is and is not, and who keeps away from the test field. */
export function Cautions() {
  return (
    <div className="space-y-3" data-testid="cautions">
      <StatusNote tone="info" word="An estimate">
        These figures are engineering estimates from published formulas and design values of the alloys, not a guarantee. The values measured on the finished shield and written on its certificate are the ones that count.
      </StatusNote>
      <StatusNote tone="caution" word="Built shields">
        The headline already allows for the lid joint, the welds, the cable holes and the shop's ceiling for this construction; the seamless-shell figure beside it is what the formulas give for a perfect shell, which no built shield reaches. A poor lid fit, knocks after the anneal or a hole without a collar can still take a built shield below the range shown.
      </StatusNote>
      <StatusNote tone="caution" word="Implants">
        People with pacemakers or other medical implants keep away from strong test fields. ICNIRP (2010) reference levels at 50/60 Hz: 1 mT for workers, 0.2 mT for the public.
      </StatusNote>
      <StatusNote tone="caution" word="Safety-critical uses">
        For medical, life-safety or other critical equipment, have the design reviewed by your own qualified engineer.
      </StatusNote>
    </div>
  );
}
