import { useTranslation } from 'react-i18next';
import { Camera, Hand, Play, Square, Unlock, X, AlertTriangle } from 'lucide-react';
import { useEffect, useRef, type ReactNode } from 'react';
import type { TrayCard } from '@shared/schemas/scans';
import type { StationKind, TrayState } from '@shared/domain/vocabulary';
import { awaitedStep } from '@shared/domain/guards';
import { formatClock, formatNumber, stepLabel } from '../lib/format';
import type { StationLang } from '../lib/refusal-text';
import { stationTexts } from '../lib/station-lang';
import { formatDate } from '../lib/format';
import { InActionBar, barButton } from './action-bar';

export interface StationInfo {
  id: string;
  name: string;
  nameZh?: string;
  kind: StationKind;
  instructions: string;
  safetyNotes: string;
  instructionsZh?: string;
  safetyNotesZh?: string;
}

export type TrayAction = 'start' | 'finish' | 'hold' | 'release' | 'photo';

/** Where the traveller stands, said from this station's point of view, and which action comes next. */
export function trayStanding(
  state: TrayState | null,
  card: TrayCard | null,
  station: StationInfo,
  now: number,
): { key: 'unknown' | 'hold' | 'here' | 'oven' | 'cureBefore' | 'next' | 'elsewhere' | 'done'; primary: 'start' | 'finish' | null } {
  if (!state || !card) return { key: 'unknown', primary: null };
  if (state.phase === 'done' || state.phase === 'scrapped' || state.phase === 'merged') return { key: 'done', primary: null };
  if (state.onHold) return { key: 'hold', primary: null };
  if (state.phase === 'in_process' && state.stationId === station.id) return { key: 'here', primary: 'finish' };
  if (state.phase === 'curing' && state.stationId === station.id) return { key: 'oven', primary: 'finish' };
  const next = awaitedStep(state, card.routing);
  if (state.phase === 'curing' && next?.stationKind === station.kind) return { key: 'cureBefore', primary: 'start' };
  if (state.phase === 'waiting' && next?.stationKind === station.kind) return { key: 'next', primary: 'start' };
  void now;
  return { key: 'elsewhere', primary: null };
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-sm font-bold uppercase tracking-wide text-harbour-700">{label}</dt>
      <dd className="text-xl">{children}</dd>
    </div>
  );
}

export function TrayPanel({
  number,
  card,
  state,
  station,
  lang,
  reasonName,
  now,
  onAction,
  onClose,
  panelOpen = false,
  children,
}: {
  number: string;
  card: TrayCard | null;
  state: TrayState | null;
  station: StationInfo;
  lang: StationLang;
  /** a hold reason's code → its name in the tablet's language */
  reasonName: (code: string) => string;
  now: number;
  onAction: (a: TrayAction) => void;
  onClose: () => void;
  /** a counting, hold or override panel is open: it brings its own buttons to the action bar */
  panelOpen?: boolean;
  children?: ReactNode;
}) {
  const { t } = useTranslation('station');
  const texts = stationTexts(station, lang);
  const panelRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (panelOpen) panelRef.current?.scrollIntoView?.({ block: 'nearest' });
  }, [panelOpen]);
  const standing = trayStanding(state, card, station, now);
  const routing = card?.routing ?? [];
  const current = state?.stepSeq != null ? routing.find((s) => s.seq === state.stepSeq) : undefined;
  const next = state && card ? awaitedStep(state, routing) : undefined;
  const shownStep = standing.key === 'here' || standing.key === 'oven' ? current : (next ?? current);
  const order = card?.order;
  const readyAt = state?.cureReadyAt ? Date.parse(state.cureReadyAt) : null;

  const status = (() => {
    switch (standing.key) {
      case 'unknown':
        return <p className="text-xl font-bold text-warn-700">{t('card.unknown', { number })}</p>;
      case 'done':
        return <p className="text-xl font-bold">{t('card.done')}</p>;
      case 'hold':
        return (
          <p className="flex items-center gap-2 text-xl font-bold text-warn-700">
            <Hand className="h-6 w-6" aria-hidden /> {t('card.onHold')}{' '}
            {state?.holdReason ? `· ${t('card.holdReason', { reason: reasonName(state.holdReason) })}` : ''}
          </p>
        );
      case 'here':
        return <p className="text-xl font-bold text-ok-700">{t('card.inProcessHere', { time: formatClock(lang, state?.startedAt) })}</p>;
      case 'oven':
      case 'cureBefore':
        return readyAt != null && readyAt <= now ? (
          <p className="text-xl font-bold text-ok-700">{t('card.ready')}</p>
        ) : (
          <p className="text-xl font-bold text-warn-700">{t('card.curingUntil', { time: formatClock(lang, state?.cureReadyAt) })}</p>
        );
      case 'next':
        return <p className="text-xl font-bold text-ok-700">{t('card.nextHere')}</p>;
      case 'elsewhere':
        return (
          <p className="flex items-center gap-2 text-xl font-bold text-warn-700">
            <AlertTriangle className="h-6 w-6" aria-hidden />{' '}
            {t('card.elsewhere', { step: `${stepLabel(t, lang, next, routing)} · ${next ? t(`kind.${next.stationKind}`) : ''}` })}
          </p>
        );
    }
  })();

  const btn = (action: TrayAction, label: string, icon: ReactNode, primary: boolean) => (
    <button type="button" onClick={() => onAction(action)} className={barButton(primary ? 'primary' : 'plain')}>
      {icon}
      {label}
    </button>
  );

  return (
    <section aria-labelledby="tray-title" data-testid="tray-card" className="flex flex-col gap-4 rounded-2xl bg-white p-5 shadow-sm">
      <header className="flex items-start justify-between gap-3">
        <div>
          <h2 id="tray-title" className="font-mono text-4xl font-bold text-harbour-900">
            {number}
          </h2>
          {order && (
            <p className="text-xl">
              <span className="font-bold">
                {t('card.order')} {order.number}
              </span>{' '}
              · {order.title}
            </p>
          )}
          {card?.tray.kind === 'mould' && <p className="text-xl font-bold">{t('card.mould')}</p>}
        </div>
        <button
          type="button"
          onClick={onClose}
          aria-label={t('card.close')}
          className="flex min-h-14 min-w-14 items-center justify-center rounded-xl bg-harbour-50"
        >
          <X className="h-8 w-8" aria-hidden />
        </button>
      </header>
      {status}
      {!card && <p className="text-lg">{t('card.unknownNext')}</p>}
      <div ref={panelRef} className="scroll-mt-2 empty:hidden">
        {children}
      </div>
      {card && state && (
        <dl className="grid grid-cols-2 gap-x-6 gap-y-3 md:grid-cols-3">
          {shownStep && (
            <Fact label={t('card.step', { seq: shownStep.seq, total: routing.length })}>
              <span className="font-bold">{stepLabel(t, lang, shownStep, routing)}</span>
            </Fact>
          )}
          <Fact label={t('card.quantityIn')}>
            <span className="text-3xl font-bold" data-testid="quantity-in">
              {formatNumber(lang, state.quantity)}
            </span>
          </Fact>
          {order && order.colours.length > 0 && (
            <Fact label={t('card.colours')}>
              <ul className="flex flex-wrap gap-2">
                {order.colours.map((c, i) => (
                  <li key={i} className={`flex items-center gap-1 rounded-lg px-1 ${shownStep?.colour === i + 1 ? 'ring-4 ring-brass-400' : ''}`}>
                    <span className="inline-block h-6 w-6 rounded border border-ink/30" style={{ background: c.hex ?? 'transparent' }} aria-hidden />
                    <span>
                      {i + 1}. {c.name}
                      {c.ref ? ` (${c.ref})` : ''}
                    </span>
                  </li>
                ))}
              </ul>
            </Fact>
          )}
          {order && <Fact label={t('card.plating')}>{t(`plating.${order.plating}`, { defaultValue: order.plating })}</Fact>}
          {order && (
            <Fact label={t('card.backing')}>
              {t(`backing.${order.backingType}`, { defaultValue: order.backingType })} × {order.backingCount}
            </Fact>
          )}
          {order && <Fact label={t('card.size')}>{t('card.sizeValue', { mm: formatNumber(lang, order.sizeMm) })}</Fact>}
          {order && <Fact label={t('card.packaging')}>{t(`packaging.${order.packaging}`, { defaultValue: order.packaging })}</Fact>}
          {order && <Fact label={t('card.due')}>{formatDate(lang, order.dueDate)}</Fact>}
          {!card.mouldReady && card.tray.kind === 'tray' && <Fact label={t('card.mould')}>{t('card.mouldNotReady')}</Fact>}
        </dl>
      )}
      {card?.artworkUrl && (
        <figure className="flex items-center gap-3">
          <img
            src={card.artworkUrl}
            alt={t('card.artwork')}
            className="h-28 w-28 rounded-xl border object-contain"
            onError={(e) => ((e.target as HTMLImageElement).style.display = 'none')}
          />
          <figcaption className="text-lg font-bold">{t('card.artwork')}</figcaption>
        </figure>
      )}
      {order?.notes && (
        <p className="rounded-xl bg-harbour-50 p-3 text-lg">
          <span className="font-bold">{t('card.notes')}: </span>
          {order.notes}
        </p>
      )}
      {!panelOpen && (
        <InActionBar>
          {btn('start', t('action.start'), <Play className="h-7 w-7" aria-hidden />, standing.primary === 'start')}
          {btn('finish', t('action.finish'), <Square className="h-6 w-6" aria-hidden />, standing.primary === 'finish')}
          {state?.onHold
            ? btn('release', t('action.release'), <Unlock className="h-6 w-6" aria-hidden />, false)
            : btn('hold', t('action.hold'), <Hand className="h-6 w-6" aria-hidden />, false)}
          {btn('photo', t('action.photo'), <Camera className="h-6 w-6" aria-hidden />, false)}
        </InActionBar>
      )}
      {(texts.instructions || texts.safetyNotes) && (
        <div className="grid gap-3 md:grid-cols-2">
          {texts.instructions && (
            <div className="rounded-xl bg-harbour-50 p-3">
              <p className="font-bold">{t('card.instructions')}</p>
              <p>{texts.instructions}</p>
            </div>
          )}
          {texts.safetyNotes && (
            <div className="rounded-xl border-2 border-warn-700 bg-warn-50 p-3">
              <p className="flex items-center gap-2 font-bold text-warn-700">
                <AlertTriangle className="h-5 w-5" aria-hidden /> {t('card.safety')}
              </p>
              <p>{texts.safetyNotes}</p>
              {!/regulation|法规/i.test(texts.safetyNotes) && <p className="mt-1 text-sm font-bold">{t('card.safetyFooter')}</p>}
            </div>
          )}
        </div>
      )}
    </section>
  );
}
