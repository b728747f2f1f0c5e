// A design as a quote's configuration (the design advisor's candidates give it) → the design
// check's form, every field filled, in the form's canonical units (mm, µT, Hz), so "open in the design check"
// shows exactly that design. The inverse of toRequestBody for the fields a configuration has.

import type { AdvisedConfiguration } from "../../../shared/schemas/design-advice";
import { defaultDesign, newLayer, type DesignDraft } from "./design-model";

export function draftFromConfiguration(c: AdvisedConfiguration): DesignDraft {
  const base = defaultDesign();
  const dims = c.dimensions_mm;
  const last = c.layers.length - 1;
  return {
    ...base,
    shape: c.shape,
    ...(c.shape === "box"
      ? { width_mm: dims.width, depth_mm: dims.depth, height_mm: dims.height }
      : { diameter_mm: dims.diameter, length_mm: dims.length }),
    ends: c.shape === "cylinder" ? c.ends : base.ends,
    // the outermost layer's gap is not sent; the form keeps its default there
    layers: c.layers.map((l, i) => newLayer({ kind: "library", material: l.material, thickness_mm: l.thickness_mm, ...(i < last && l.gap_mm !== undefined ? { gap_mm: l.gap_mm } : {}) })),
    state: c.state,
    amplitude_uT: c.field.amplitude_uT,
    frequency_hz: c.field.frequency_hz,
    orientation: c.shape === "cylinder" ? c.field.orientation : "transverse",
    method: c.shape === "cylinder" ? c.method : base.method,
    holes: [],
  };
}
