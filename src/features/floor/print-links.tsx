/** PDF links for a traveler or a label on A4 and US Letter; each opens in a new tab to print (the server records the print). */
export function PrintLinks({ what, url, testId }: { what: string; url: (paper: "A4" | "LETTER") => string; testId?: string }) {
  const link = "inline-flex min-h-touch items-center rounded-md border border-flux-300 bg-white px-4 font-semibold text-flux-800 hover:border-flux-500 hover:bg-flux-50";
  return (
    <span className="inline-flex flex-wrap gap-2" data-testid={testId}>
      <a className={link} href={url("A4")} target="_blank" rel="noopener">
        {what} (A4 PDF)
      </a>
      <a className={link} href={url("LETTER")} target="_blank" rel="noopener">
        {what} (Letter PDF)
      </a>
    </span>
  );
}
