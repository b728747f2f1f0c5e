/** The shop's own details (documents, mail sender) and an organisation's document paper size. */
import { z } from "zod";
import type { AnnealWindow, Furnace } from "../shop-floor/anneal";
import { annealWindowsSchema, furnacesSchema } from "./furnace-runs";

const line = (what: string, max: number) => z.string({ error: `${what} must be text.` }).trim().max(max, { error: `Keep ${what.toLowerCase()} under ${max} characters.` });

/** "Name <address@domain>" or a bare address, as mail headers take it. */
const mailbox = z
  .string({ error: "Give the sender address." })
  .trim()
  .max(200)
  .refine((s) => /^(?:[^<>@\n]*<[^<>\s@]+@[^<>\s@]+\.[^<>\s@]+>|[^<>\s@]+@[^<>\s@]+\.[^<>\s@]+)$/.test(s), { error: "Give an address like Shop name <orders@shop.example>." });

export const shopSettingsSchema = z.object({
  name: line("The shop name", 200).min(1, { error: "Give the shop's name." }),
  address: line("The address", 1000),
  email: line("The e-mail", 200),
  phone: line("The phone", 60),
  taxId: line("The tax number", 60),
  /** the From of every mail the app sends */
  mailFrom: mailbox,
  quoteTerms: line("The terms", 4000),
  /** the hydrogen furnaces and their heaviest loads (omitted: unchanged) */
  furnaces: furnacesSchema.optional(),
  /** each alloy's final-anneal window, which furnace runs are checked against (omitted: unchanged) */
  annealWindows: annealWindowsSchema.optional(),
});
export type ShopSettingsInput = z.input<typeof shopSettingsSchema>;
export type ShopSettingsJson = Omit<z.output<typeof shopSettingsSchema>, "furnaces" | "annealWindows"> & { furnaces: Furnace[]; annealWindows: AnnealWindow[]; updatedAt: string };

export const paperSizes = ["A4", "LETTER"] as const;
export type PaperSize = (typeof paperSizes)[number];
export const organizationSettingsSchema = z.object({
  paperSize: z.enum(paperSizes, { error: 'Paper size must be "A4" or "LETTER".' }),
});
export interface OrganizationSettingsJson {
  id: string;
  name: string;
  kind: "shop" | "customer";
  paperSize: PaperSize;
}
