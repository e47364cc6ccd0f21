// The suggested and chosen minimum sizes of one logo, on screen and in print, with where the suggestion comes from.
import type { IdentityLogo } from '@/lib/identity/types';
import { r2 } from './labels';

export function MinimumSize({ size: ms }: { size: IdentityLogo['minimumSize'] }) {
  return (
    <section aria-label="Minimum sizes" className="rounded-lg bg-paper px-4 py-3">
      <h4 className="text-sm font-semibold">Minimum size</h4>
      <table className="mt-2 w-full text-sm">
        <thead className="text-xs text-ink-faint">
          <tr><th scope="col" className="text-left font-semibold"></th><th scope="col" className="text-right font-semibold">Suggested</th><th scope="col" className="text-right font-semibold">Chosen</th></tr>
        </thead>
        <tbody className="font-mono">
          <tr><th scope="row" className="text-left font-sans font-normal">Screen</th><td className="text-right">{ms.suggested.screenPx} px</td><td className="text-right font-semibold">{ms.screenPx} px</td></tr>
          <tr><th scope="row" className="text-left font-sans font-normal">Print</th><td className="text-right">{ms.suggested.printMm} mm</td><td className="text-right font-semibold">{ms.printMm} mm</td></tr>
        </tbody>
      </table>
      <p className="mt-2 text-xs leading-relaxed text-ink-soft">
        Suggested so the thinnest stroke ({r2(ms.thinnestStroke)} logo units) stays at least 1 px on screen and 0.25 pt in print. These thresholds are common practice, not a
        standard: check small sizes with your printer.
      </p>
    </section>
  );
}
