import type { PaperSize } from "../../shared/schemas/shop-settings";
import { AFTER_ANNEAL_CAUTION } from "../../shared/shop-floor/anneal";
import { dataMatrix } from "./barcodes";
import { ACCENT, INK, MUTED, RULE, contentWidth, createDocument, fmtDate, num, pdfText, toBuffer, type ShopDetails } from "./pdf";

export interface LotLabelData {
  number: string;
  orderNumber: string;
  customer: string;
  materialName: string;
  pieces: number;
  mass_kg: number;
  dueDate: string;
  heats: string[];
  furnaceRun: string | null;
  jobs: string[];
}

const COLUMNS = 2;
const ROWS = 4;

/**
 * A sheet of identical lot labels (2 × 4 on A4 or US Letter) for the lot's crates and bags: the lot
 * number large with a Data Matrix of it, the order and customer, alloy, pieces, heats, furnace run
 * and the handling caution. Cut along the rules.
 */
export async function renderLotLabels(props: { lot: LotLabelData; paperSize: PaperSize; shop: ShopDetails; printedAt: Date }): Promise<Buffer> {
  const { lot } = props;
  const doc = createDocument({ paperSize: props.paperSize, title: `Lot label ${lot.number}`, author: props.shop.name, subject: `Lot ${lot.number}, order ${lot.orderNumber}` });
  const left = doc.page.margins.left;
  const top = doc.page.margins.top;
  const width = contentWidth(doc);
  const height = doc.page.height - top - doc.page.margins.bottom;
  const w = width / COLUMNS;
  const h = height / ROWS;
  const symbol = await dataMatrix(lot.number);
  const lines = [
    `Order ${lot.orderNumber} · ${lot.customer}`,
    `${lot.materialName}`,
    `${lot.pieces} piece${lot.pieces === 1 ? "" : "s"} · ${num(lot.mass_kg, 1)} kg · due ${fmtDate(new Date(`${lot.dueDate}T00:00:00Z`))}`,
    `Heat${lot.heats.length === 1 ? "" : "s"}: ${lot.heats.length ? lot.heats.join(", ") : "not issued yet"}`,
    `Furnace run: ${lot.furnaceRun ?? "not yet annealed"}`,
    `Jobs: ${lot.jobs.join(", ")}`,
  ];
  for (let r = 0; r < ROWS; r++) {
    for (let c = 0; c < COLUMNS; c++) {
      const x = left + c * w;
      const y = top + r * h;
      doc.rect(x, y, w, h).lineWidth(0.4).dash(2, { space: 3 }).strokeColor(RULE).stroke().undash();
      const pad = 12;
      const side = Math.min(58, h - 2 * pad - 30);
      const textWidth = w - side - 3 * pad;
      doc.image(symbol, x + w - pad - side, y + pad, { width: side, height: side });
      doc.font("body").fontSize(7).fillColor(MUTED).text(pdfText(props.shop.name), x + pad, y + pad, { width: textWidth });
      doc.font("display").fontSize(19).fillColor(INK).text(`LOT ${lot.number}`, x + pad, y + pad + 10, { width: textWidth });
      let ly = y + pad + 38;
      for (const [i, line] of lines.entries()) {
        // beside the symbol the lines are narrower
        const lw = ly < y + pad + side + 2 && i < 3 ? textWidth : w - 2 * pad;
        doc.font("body").fontSize(7.5).fillColor(INK).text(pdfText(line), x + pad, ly, { width: lw, height: 20, ellipsis: true });
        ly = doc.y + 1;
      }
      doc.font("bold").fontSize(6.5).fillColor(ACCENT).text(pdfText(AFTER_ANNEAL_CAUTION), x + pad, Math.max(ly + 2, y + h - pad - 18), { width: w - 2 * pad, height: 18, ellipsis: true });
    }
  }
  return toBuffer(doc);
}
