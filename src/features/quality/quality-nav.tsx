import { SectionNav, type SectionPage } from "../../components/ui/section-nav";
import { paths } from "../../config/paths";

// The quality pages link to each other here, so the planner's main menu needs one link to them all
// (the quality inspectors and the planner may open every one; the server decides).
const pages: SectionPage[] = [
  { label: "Lots to inspect", to: paths.qualityLots.href() },
  { label: "Instruments", to: paths.instruments.href() },
  { label: "Calibration", to: paths.calibration.href() },
  { label: "Control charts", to: paths.controlCharts.href() },
];

export function QualityNav() {
  return <SectionNav label="Quality" pages={pages} />;
}
