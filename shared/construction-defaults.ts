// The shop's construction defaults, in one place: the flat-blank page, the design check's parts
// and price, the fabrication engine's fallbacks and the as-built prediction's lid all read them,
// so a blank opened from the design check comes out as the one typed on the flat-blank page.
// [practice]

/** Drawn cup: the inside corner radius at the bottom (the punch radius) for the innermost layer; outer layers add their growth. */
export const DEFAULT_CORNER_RADIUS_MM = 3;
/** Rolled can: a fusion butt weld (no overlap), which keeps the magnetic path continuous. */
export const DEFAULT_SEAM_OVERLAP_MM = 0;
/** Drawn cup: no trim allowance unless asked. */
export const DEFAULT_TRIM_MM = 0;
/** Bent box: the inside bend radius, one sheet thickness (about the tightest nickel-iron takes without cracking). */
export const defaultBendRadius_mm = (thickness_mm: number): number => thickness_mm;
/** Slip-on lids: clearance per side; a close lid keeps the magnetic joint short. */
export const DEFAULT_LID_CLEARANCE_MM = 0.2;
/** Slip-on lids: the skirt overlaps the body by a quarter of its height (or length), at least 10 mm, at most all of it. */
export const LID_OVERLAP_FRACTION = 0.25;
export const LID_OVERLAP_MIN_MM = 10;
export const defaultLidHeight = (bodyHeight_mm: number): number => Math.min(bodyHeight_mm, Math.max(LID_OVERLAP_MIN_MM, LID_OVERLAP_FRACTION * bodyHeight_mm));

/**
 * The part both public pages open on: the design check's default design (a closed drawn can,
 * one ni80 layer) and, for its innermost layer, the flat-blank page, so the two agree at first sight.
 */
export const DEFAULT_PART = {
  shape: "cylinder",
  method: "drawn",
  diameter_mm: 50,
  length_mm: 120,
  thickness_mm: 1,
  material: "ni80",
} as const;
