import { useCallback, useEffect } from 'react';
import { WhorlMark } from '@/components/layouts/whorl-mark';
import type { Showcase } from '@/types/showcase';

// Printing: the page prints as a one- or two-page sheet (photo, facts, materials, notes; no buttons or comments),
// or, with "Print table card", as a single card with the QR code for a craft-fair table. The dark theme is
// switched off while printing so ink lands on white paper.

export const PRINT_CSS = `
@media screen { .wb-table-card { display: none !important; } }
@media print {
  @page { margin: 14mm; }
  html, body { background: #fff !important; color: #2A2622 !important; }
  .wb-table-card { display: none !important; }
  html[data-print="card"] .wb-showcase-page { display: none !important; }
  html[data-print="card"] .wb-table-card { display: flex !important; }
  a { color: inherit !important; text-decoration: none !important; }
}
`;

/** Keeps the theme light while printing, whichever way printing started (button or the browser's menu). */
export function usePrintLight() {
  useEffect(() => {
    const root = document.documentElement;
    let wasDark = false;
    const before = () => {
      wasDark = root.classList.contains('dark');
      root.classList.remove('dark');
    };
    const after = () => {
      if (wasDark) root.classList.add('dark');
      delete root.dataset.print;
    };
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    return () => {
      window.removeEventListener('beforeprint', before);
      window.removeEventListener('afterprint', after);
    };
  }, []);
}

export function usePrint() {
  return useCallback((mode: 'page' | 'card') => {
    document.documentElement.dataset.print = mode;
    window.print();
  }, []);
}

/** A folded-card sized sheet for a fair table: what it is, who made it, whose pattern, and the QR code to the page. */
export function TableCard({ showcase, qr }: { showcase: Showcase; qr: string | null }) {
  return (
    <div className="wb-table-card mx-auto min-h-[60vh] max-w-[15cm] flex-col items-center justify-center gap-5 rounded-[1cm] border-2 border-ink/30 p-[1cm] text-center" data-testid="table-card">
      <p className="flex items-center gap-2 text-lg font-bold">
        <WhorlMark className="h-8 w-8" /> Whorlbook
      </p>
      <h2 className="text-[28pt] font-bold leading-tight">{showcase.title}</h2>
      <p className="text-[14pt]">Made by {showcase.maker.displayName}</p>
      {showcase.pattern ? (
        <p className="text-[12pt]">
          Pattern: {showcase.pattern.title}
          {showcase.pattern.designerCredit ? ` by ${showcase.pattern.designerCredit}` : ''}
        </p>
      ) : null}
      {qr ? <img src={qr} alt="QR code of the link to this page" className="h-[6cm] w-[6cm]" /> : null}
      <p className="text-[12pt] font-semibold">Scan to see the photos and how it was made</p>
      <p className="break-all text-[9pt] text-ink/70">{showcase.url}</p>
    </div>
  );
}
