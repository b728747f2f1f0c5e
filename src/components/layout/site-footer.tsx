export function SiteFooter() {
  return (
    <footer className="border-t border-nickel-200 bg-white">
      <div className="mx-auto flex max-w-page flex-wrap items-center justify-between gap-2 px-4 py-4 text-meta text-flux-700 sm:px-6">
        <p>Predictions are engineering estimates; measured values on the certificate rule.</p>
        <p className="font-mono">Fluxwright</p>
      </div>
    </footer>
  );
}
