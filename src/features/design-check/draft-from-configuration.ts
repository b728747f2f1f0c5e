// A design as a quote's configuration (the design advisor's candidates give it) → the design
// check's form, every field filled, in millimetres and microtesla, so "open in the design check"
// shows exactly that design. The inverse of toRequestBody for the fields a configuration has.

import type { AdvisedConfiguration } from "../../../shared/schemas/design-advice";
import { defaultDesign, newLayer, type DesignDraft } from "./design-model";

const text = (x: number) => String(x);

export function draftFromConfiguration(c: AdvisedConfiguration): DesignDraft {
  const base = defaultDesign();
  const dims = c.dimensions_mm;
  const last = c.layers.length - 1;
  return {
    ...base,
    shape: c.shape,
    unit: "mm",
    ...(c.shape === "box"
      ? { width: text(dims.width), depth: text(dims.depth), height: text(dims.height) }
      : { diameter: text(dims.diameter), length: text(dims.length) }),
    ends: c.shape === "cylinder" ? c.ends : base.ends,
    // the outermost layer's gap is not sent; the form keeps its default there
    layers: c.layers.map((l, i) => newLayer({ kind: "library", material: l.material, thickness: text(l.thickness_mm), ...(i < last && l.gap_mm !== undefined ? { gap: text(l.gap_mm) } : {}) })),
    state: c.state,
    amplitude: text(c.field.amplitude_uT),
    fieldUnit: "uT",
    frequency: text(c.field.frequency_hz),
    orientation: c.shape === "cylinder" ? c.field.orientation : "transverse",
    method: c.shape === "cylinder" ? c.method : base.method,
    holes: [],
  };
}
