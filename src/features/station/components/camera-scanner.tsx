import { useEffect, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Flashlight, FlashlightOff } from 'lucide-react';
import type { IScannerControls } from '@zxing/browser';

/** Continuous QR reading from the rear camera, with a frame to aim at and the light where the device has one. */
export function CameraScanner({ onScan }: { onScan: (text: string) => void }) {
  const { t } = useTranslation('station');
  const video = useRef<HTMLVideoElement>(null);
  const controls = useRef<IScannerControls | null>(null);
  const last = useRef<{ text: string; at: number }>({ text: '', at: 0 });
  const handler = useRef(onScan);
  handler.current = onScan;
  const [error, setError] = useState(false);
  const [torch, setTorch] = useState<boolean | null>(null);

  useEffect(() => {
    let stopped = false;
    void (async () => {
      try {
        const { BrowserQRCodeReader } = await import('@zxing/browser');
        const reader = new BrowserQRCodeReader(undefined, { delayBetweenScanAttempts: 150 });
        const c = await reader.decodeFromConstraints({ video: { facingMode: 'environment' } }, video.current!, (result) => {
          if (!result) return;
          const text = result.getText();
          const now = Date.now();
          // the same code stays in view: read it once, not ten times a second
          if (text === last.current.text && now - last.current.at < 2500) return;
          last.current = { text, at: now };
          handler.current(text);
        });
        if (stopped) return c.stop();
        controls.current = c;
        if (c.switchTorch) setTorch(false);
      } catch {
        setError(true);
      }
    })();
    return () => {
      stopped = true;
      controls.current?.stop();
      controls.current = null;
    };
  }, []);

  if (error)
    return (
      <p role="alert" className="rounded-xl bg-warn-50 p-4 text-lg font-bold text-warn-700">
        {t('scan.cameraDenied')}
      </p>
    );
  return (
    <div className="relative overflow-hidden rounded-2xl bg-ink">
      <video ref={video} className="aspect-video w-full object-cover" muted playsInline aria-label={t('scan.cameraFrame')} />
      <div className="pointer-events-none absolute inset-0 flex items-center justify-center">
        <div className="h-3/5 aspect-square rounded-2xl border-4 border-brass-400 shadow-[0_0_0_9999px_rgba(0,0,0,0.35)]" />
      </div>
      <p className="absolute bottom-2 left-0 right-0 text-center text-lg font-bold text-white">{t('scan.cameraFrame')}</p>
      {torch !== null && (
        <button
          type="button"
          onClick={() => {
            const on = !torch;
            void controls.current?.switchTorch?.(on).then(() => setTorch(on));
          }}
          className="absolute right-2 top-2 flex min-h-12 items-center gap-2 rounded-xl bg-white/90 px-3 font-bold text-harbour-900"
        >
          {torch ? <FlashlightOff className="h-6 w-6" aria-hidden /> : <Flashlight className="h-6 w-6" aria-hidden />}
          {torch ? t('scan.torchOff') : t('scan.torchOn')}
        </button>
      )}
    </div>
  );
}
