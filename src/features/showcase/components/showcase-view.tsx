import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { Flag, Printer, QrCode as QrIcon, ArrowLeft, MessageCircle } from 'lucide-react';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import type { Showcase } from '@/types/showcase';
import { plural } from '../format';
import { PhotoGallery } from './photo-gallery';
import { Changes, Facts, Journal, Materials, PatternCredit, Pieces } from './showcase-sections';
import { CheerButton } from './cheer-button';
import { CommentsSection } from './comments-section';
import { ReportDialog } from './report-dialog';
import { PRINT_CSS, TableCard, usePrint, usePrintLight } from './print';
import { useQrDataUrl } from './qr-code';

/** The finished-project page as friends see it. Nothing here ever shows an e-mail address. */
export function ShowcaseView({ showcase, autoPrint, onAutoPrinted }: { showcase: Showcase; autoPrint?: 'card' | 'page' | null; onAutoPrinted?: () => void }) {
  const { viewer, token } = showcase;
  const [reporting, setReporting] = useState(false);
  const qr = useQrDataUrl(showcase.url);
  const print = usePrint();
  usePrintLight();

  useEffect(() => {
    document.title = `${showcase.title} by ${showcase.maker.displayName} · Whorlbook`;
  }, [showcase.title, showcase.maker.displayName]);

  // Opened from the share panel's "Print table card": print once the QR code is drawn.
  useEffect(() => {
    if (!autoPrint || (autoPrint === 'card' && !qr)) return;
    const id = window.setTimeout(() => {
      print(autoPrint);
      onAutoPrinted?.();
    }, 300);
    return () => window.clearTimeout(id);
  }, [autoPrint, qr, print, onAutoPrinted]);

  return (
    <>
      <style>{PRINT_CSS}</style>
      <div className="wb-showcase-page mx-auto max-w-3xl space-y-5 px-4 pb-16 pt-2 print:max-w-none print:space-y-3 print:p-0">
        {viewer.isOwner ? (
          <Banner
            tone="info"
            title="This is your page"
            className="print:hidden"
            action={
              viewer.ownerProjectId ? (
                <Link to={paths.project(viewer.ownerProjectId)} className="flex min-h-tap items-center gap-1 font-semibold text-moss underline">
                  <ArrowLeft aria-hidden className="h-4 w-4" /> Project
                </Link>
              ) : undefined
            }
          >
            Friends with the link see it just like this. Change what is shared from the project&apos;s Sharing panel.
          </Banner>
        ) : null}

        <PhotoGallery photos={showcase.photos} title={showcase.title} />

        <header className="space-y-2">
          <h1 className="text-3xl font-bold leading-tight sm:text-4xl print:text-2xl">{showcase.title}</h1>
          <p className="text-lg">
            Made by{' '}
            {showcase.maker.profileUrl ? (
              <Link to={showcase.maker.profileUrl} className="font-bold text-moss underline dark:text-[#9cc3a8] print:no-underline">
                {showcase.maker.displayName}
              </Link>
            ) : (
              <span className="font-bold">{showcase.maker.displayName}</span>
            )}
            {showcase.pattern ? (
              <span className="text-ink/75 dark:text-oat/75">
                {' '}
                from “{showcase.pattern.title}”{showcase.pattern.designerCredit ? ` by ${showcase.pattern.designerCredit}` : ''}
              </span>
            ) : null}
          </p>
        </header>

        <Facts showcase={showcase} />

        <div className="flex flex-wrap items-center gap-3 print:hidden">
          <CheerButton token={token} cheers={showcase.cheers} signedIn={viewer.signedIn} />
          <a href="#comments" className="flex min-h-tap items-center gap-2 rounded-soft px-3 font-semibold text-moss hover:bg-wool/60 dark:text-[#9cc3a8]">
            <MessageCircle aria-hidden className="h-5 w-5" />
            {showcase.commentCount ? plural(showcase.commentCount, 'comment') : 'Comments'}
          </a>
        </div>

        {showcase.cautions.map((c) => (
          <Banner key={c.code} tone="caution" title={c.title} className="print:break-inside-avoid">
            {c.message}
          </Banner>
        ))}

        {showcase.pattern ? <PatternCredit pattern={showcase.pattern} /> : null}
        <Materials materials={showcase.materials} />
        <Pieces pieces={showcase.pieces} placements={showcase.placements} />
        <Changes changes={showcase.changes} />
        <Journal entries={showcase.journal} />
        <CommentsSection token={token} signedIn={viewer.signedIn} isOwner={viewer.isOwner} />

        <footer className="flex flex-wrap gap-2 border-t border-wool pt-4 dark:border-[#4a423c] print:hidden">
          <Button variant="secondary" onClick={() => print('page')}>
            <Printer aria-hidden className="h-5 w-5" /> Print this page
          </Button>
          <Button variant="secondary" onClick={() => print('card')} disabled={!qr}>
            <QrIcon aria-hidden className="h-5 w-5" /> Print table card
          </Button>
          {viewer.signedIn && !viewer.isOwner ? (
            <Button variant="quiet" onClick={() => setReporting(true)} className="ml-auto">
              <Flag aria-hidden className="h-4 w-4" /> Report this page
            </Button>
          ) : !viewer.signedIn ? (
            <Link to={`${paths.signIn}?next=${encodeURIComponent(paths.showcase(token))}`} className="ml-auto flex min-h-tap items-center gap-2 px-3 font-semibold text-moss underline dark:text-[#9cc3a8]">
              <Flag aria-hidden className="h-4 w-4" /> Sign in to report this page
            </Link>
          ) : null}
        </footer>
        <div className="hidden items-center gap-3 border-t border-ink/20 pt-2 text-xs print:flex print:break-inside-avoid">
          {qr ? <img src={qr} alt="" className="h-[2.2cm] w-[2.2cm]" /> : null}
          <p>
            Scan or visit <span className="break-all font-semibold">{showcase.url}</span> for the photos and comments. Shared from Whorlbook.
          </p>
        </div>
      </div>
      <TableCard showcase={showcase} qr={qr} />
      {reporting ? <ReportDialog target={{ shareToken: token }} onClose={() => setReporting(false)} /> : null}
    </>
  );
}
