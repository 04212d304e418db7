import { useEffect, useState } from 'react';
import QRCode from 'qrcode';
import { cn } from '@/utils/cn';

/**
 * The link as a QR code image, drawn in the browser by the qrcode package. Error correction "M" (about 15% of the
 * code can be damaged and still read — ISO/IEC 18004) survives a creased card on a fair table; ink on white
 * because scanners need the contrast, whatever the theme. (Recovery figure from memory.)
 */
export const QR_OPTIONS = { errorCorrectionLevel: 'M', margin: 2, width: 512, color: { dark: '#2A2622', light: '#FFFFFF' } } as const;

export function useQrDataUrl(text: string | null | undefined) {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    if (!text) {
      setUrl(null);
      return;
    }
    QRCode.toDataURL(text, QR_OPTIONS).then(
      (u) => live && setUrl(u),
      () => live && setUrl(null),
    );
    return () => {
      live = false;
    };
  }, [text]);
  return url;
}

export function QrCode({ text, className, label = 'QR code of the link to this page' }: { text: string; className?: string; label?: string }) {
  const url = useQrDataUrl(text);
  return url ? (
    <img src={url} alt={label} className={cn('aspect-square bg-white', className)} data-testid="qr-code" />
  ) : (
    <div role="img" aria-label={`${label} (drawing…)`} className={cn('aspect-square animate-pulse rounded-soft bg-wool', className)} />
  );
}
