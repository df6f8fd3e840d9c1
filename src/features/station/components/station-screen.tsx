import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Camera, CameraOff, Keyboard, LogOut, Languages, ScanLine, Users } from 'lucide-react';
import { ApiError } from '@/lib/api-client';
import type { OverrideKind } from '@shared/domain/guards';
import { correctedIso } from '@shared/domain/clock-offset';
import { parseTravellerCode } from '@shared/domain/traveller-code';
import type { RejectionCode, RoutingStep, TrayState } from '@shared/domain/vocabulary';
import type { ScanEvent, TrayCard } from '@shared/schemas/scans';
import type { ReasonCodeView } from '@shared/schemas/stations';
import { lookupTray } from '../api/lookup-tray';
import { stationDb, type OutboxEntry } from '../lib/station-db';
import type { SyncEngine } from '../lib/sync-engine';
import { evaluateLocal, localVerdict, replayState } from '../lib/local-guard';
import { useExternal, useIdle, useLive, useNow, useWedgeScanner } from '../lib/hooks';
import { playFeedback, unlockAudio, type FeedbackKind } from '../lib/feedback';
import { describeRefusal, reasonNamer, type StationLang } from '../lib/refusal-text';
import { formatClock, stepLabel } from '../lib/format';
import { resizePhoto } from '../lib/photo';
import { newId } from '../lib/ids';
import { NetStatus } from './net-status';
import { FeedbackZone, type FeedbackView } from './feedback-banner';
import { ActionBarSlot } from './action-bar';
import { stationTexts } from '../lib/station-lang';
import { CameraScanner } from './camera-scanner';
import { TrayPanel, type StationInfo, type TrayAction } from './tray-panel';
import { FinishPanel, type FinishCounts } from './finish-panel';
import { HoldPanel } from './hold-panel';
import { OverridePanel } from './override-panel';
import { QueueLists } from './queue-lists';
import { newlyCured, stationQueue } from '../lib/station-queue';
import { overrideFor, type OverridePanelKind, type RefusalChoices, type RetryScan } from '../lib/refusal-choices';
import { RefusedPanel } from './refused-panel';
import type { Operator } from './sign-in-panel';
import { cures } from '@shared/domain/traveller/station-kinds';

type Panel = null | 'finish' | 'hold' | { override: OverridePanelKind; retry: RetryScan };

interface Current {
  code: string;
  number: string;
}

const RECENT_MS = 36 * 3600_000;

export function StationScreen({
  station,
  operator,
  engine,
  lang,
  idleMinutes,
  reasons,
  onSignOut,
  onSwitch,
  onToggleLang,
}: {
  station: StationInfo;
  operator: Operator;
  engine: SyncEngine;
  lang: StationLang;
  idleMinutes: number;
  reasons: ReasonCodeView[];
  onSignOut: () => void;
  onSwitch: () => void;
  onToggleLang: () => void;
}) {
  const { t } = useTranslation('station');
  const db = stationDb();
  const status = useExternal(engine.subscribe, engine.getStatus);
  const clock = useCallback(() => engine.now(), [engine]);
  const now = useNow(1000, clock);
  const cards = useLive(() => db.cards.toArray(), [], []);
  const recent = useLive(
    () =>
      db.outbox
        .where('createdAt')
        .above(Date.now() - RECENT_MS)
        .toArray(),
    [],
    [] as OutboxEntry[],
  );
  const [current, setCurrent] = useState<Current | null>(null);
  const [panel, setPanel] = useState<Panel>(null);
  const [feedback, setFeedback] = useState<FeedbackView | null>(null);
  const [camera, setCamera] = useState(false);
  const [typed, setTyped] = useState('');
  /** a supervisor approved an early or wrong-station finish: the counts still come from the operator */
  const [finishOverride, setFinishOverride] = useState<{ id: string; kind: OverrideKind } | null>(null);
  const serial = useRef(0);
  const photoInput = useRef<HTMLInputElement>(null);
  const guardStation = useMemo(() => ({ id: station.id, kind: station.kind, name: station.name }), [station]);
  const reasonCodes = useMemo(() => reasons.map((r) => r.code), [reasons]);
  const reasonName = useMemo(() => reasonNamer(reasons, lang), [reasons, lang]);
  const time = useCallback((iso: unknown) => formatClock(lang, iso), [lang]);

  const idle = useIdle(idleMinutes, onSignOut, true);
  const stepWithKind = (step: RoutingStep, routing: readonly RoutingStep[]) => {
    const label = stepLabel(t, lang, step, routing);
    const kind = t(`kind.${step.stationKind}`);
    return label.includes(kind) ? label : `${label} (${kind})`;
  };

  const say = useCallback((kind: FeedbackKind, view: Omit<FeedbackView, 'kind' | 'serial'>) => {
    serial.current += 1;
    setFeedback({ kind, serial: serial.current, ...view });
    playFeedback(kind);
  }, []);

  // --- the tablet's view of each traveller ------------------------------------------------
  const byNumber = useMemo(() => new Map(cards.map((c) => [c.number, c])), [cards]);
  const stateOf = useCallback(
    (number: string): { card: TrayCard | null; state: TrayState | null } => {
      const cached = byNumber.get(number);
      if (!cached) return { card: null, state: null };
      return { card: cached.card, state: replayState(cached.card, cached.asOf, recent, guardStation, now, operator.role) };
    },
    [byNumber, recent, guardStation, now, operator.role],
  );

  const lists = useMemo(
    () =>
      stationQueue(
        cards.map((c) => ({ number: c.number, card: c.card, state: stateOf(c.number).state })),
        station,
        now,
      ),
    [cards, stateOf, now, station],
  );

  // Cure stations: a tray turning ready is announced once, with a sound.
  const announced = useRef(new Set<string>());
  useEffect(() => {
    if (!cures(station.kind)) return;
    for (const i of newlyCured(lists.curing, announced.current)) {
      announced.current.add(i.number);
      if (i.minutes > -1) say('accepted', { title: `${i.number} · ${t('card.ready')}` });
    }
  }, [lists.curing, station.kind, say, t]);

  // The server refused a scan that had already left the tablet: tell the operator at once.
  const refusedUnseen = useMemo(() => recent.filter((e) => e.status === 'rejected' && !e.seen), [recent]);
  const lastRefusals = useRef(refusedUnseen.length);
  useEffect(() => {
    if (refusedUnseen.length > lastRefusals.current) {
      const e = refusedUnseen[refusedUnseen.length - 1];
      const m = e.code ? describeRefusal(lang, e.code, e.params ?? {}, time, reasonName) : null;
      say('refused', { title: `${t('feedback.serverRefused')}: ${e.trayNumber}`, detail: m ? `${m.title}. ${m.detail}` : undefined, next: m?.next });
    }
    lastRefusals.current = refusedUnseen.length;
  }, [refusedUnseen, lang, say, t, time, reasonName]);

  // --- scanning ---------------------------------------------------------------------------
  const openCode = useCallback(
    async (raw: string) => {
      unlockAudio();
      const text = raw.trim();
      const parsed = parseTravellerCode(text);
      if (!parsed) {
        say('refused', { title: t('scan.notACode'), detail: text.slice(0, 40) });
        return;
      }
      setPanel(null);
      setFinishOverride(null);
      setCurrent({ code: text, number: parsed.number });
      const cached = await db.cards.get(parsed.number);
      if (!cached && engine.getStatus().online) {
        try {
          await lookupTray(text, new Date(engine.now()).toISOString());
        } catch (error) {
          if (error instanceof ApiError && (error.status === 404 || error.status === 409)) {
            const code = (error.code === 'void_traveller' || error.code === 'bad_signature' ? error.code : 'unknown_tray') as RejectionCode;
            const m = describeRefusal(lang, code, { currentRevision: (error.body.currentRevision as number | undefined) ?? null }, time);
            say('refused', { title: m.title, detail: m.detail, next: m.next });
            setCurrent(null);
            return;
          }
        }
      }
      const card = (await db.cards.get(parsed.number))?.card ?? null;
      const verdict = localVerdict(text, card);
      if (verdict.status === 'void') {
        const m = describeRefusal(lang, 'void_traveller', { currentRevision: verdict.currentRevision ?? null }, time);
        say('refused', { title: m.title, detail: m.detail, next: m.next });
        return;
      }
      setFeedback(null);
    },
    [db, engine, lang, say, t, time],
  );

  useWedgeScanner((text) => void openCode(text), panel === null || panel === 'finish');

  // --- actions ------------------------------------------------------------------------------
  const act = useCallback(
    async (type: ScanEvent['type'], extra: Partial<ScanEvent> = {}, override?: { id: string; kind: OverrideKind }) => {
      if (!current) return;
      const { card, state } = stateOf(current.number);
      const event: ScanEvent = {
        id: newId(),
        code: current.code,
        stationId: station.id,
        type,
        occurredAt: correctedIso(Date.now(), engine.getStatus().offset),
        operatorId: operator.id,
        ...extra,
        ...(override ? { overrideId: override.id } : {}),
      };
      if (card && state) {
        const r = evaluateLocal({ card, state, station: guardStation, event, now: engine.now(), role: operator.role, override, reasonCodes });
        if (!r.ok) {
          const m = describeRefusal(lang, r.code, r.params, time, reasonName);
          const choices: RefusalChoices = { code: r.code, override: overrideFor(r.code, r.overridable), retry: { type, ...extra }, event };
          say('refused', { title: m.title, detail: m.detail, next: m.next, choices });
          if (!choices.override) setPanel(null);
          return false;
        }
        await engine.add(event, { trayNumber: current.number, local: { ok: true }, overrideKind: override?.kind });
        const next = r.next;
        const nextStep = next.stepSeq != null ? card.routing.find((s) => s.seq === next.stepSeq) : undefined;
        const title =
          type === 'start' ? t('feedback.started') : type === 'finish' ? t('feedback.finished') : type === 'hold' ? t('feedback.held') : t('feedback.released');
        say('accepted', {
          title: `${title}: ${current.number}`,
          detail:
            type === 'finish'
              ? `${t('feedback.goodScrap', { good: extra.goodQty ?? state.quantity, scrap: extra.scrapQty ?? 0 })}${nextStep && next.phase === 'waiting' ? ` · ${t('feedback.nextTo', { step: stepWithKind(nextStep, card.routing) })}` : ''}`
              : undefined,
          next: status.online ? undefined : t('feedback.savedOffline'),
        });
      } else {
        await engine.add(event, { trayNumber: current.number, local: null, overrideKind: override?.kind });
        say('warning', { title: `${t('feedback.savedOffline')}: ${current.number}`, detail: t('feedback.checkLater') });
      }
      setPanel(null);
      if (type === 'finish') setCurrent(null);
      return true;
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [current, stateOf, station.id, engine, operator, guardStation, reasonCodes, lang, time, say, t, status.online],
  );

  const sendAnyway = useCallback(
    async ({ event, code }: RefusalChoices) => {
      await engine.add(event, { trayNumber: parseTravellerCode(event.code)?.number ?? event.code, local: { ok: false, code } });
      say('warning', { title: t('feedback.savedOffline'), detail: t('feedback.checkLater') });
    },
    [engine, say, t],
  );
  const askOverride = useCallback(({ override, retry }: RefusalChoices) => override && setPanel({ override, retry }), []);

  const onAction = (a: TrayAction) => {
    unlockAudio();
    if (a === 'start') void act('start');
    else if (a === 'finish') {
      // Say at once when a finish cannot be right here (not started, on hold, still curing...),
      // before anyone counts pieces; the counts themselves are checked when confirmed.
      const { card, state } = current ? stateOf(current.number) : { card: null, state: null };
      if (card && state) {
        const probe = evaluateLocal({
          card,
          state,
          station: guardStation,
          event: { type: 'finish', code: current!.code, occurredAt: correctedIso(Date.now(), engine.getStatus().offset), goodQty: state.quantity, scrapQty: 0 },
          now: engine.now(),
          role: operator.role,
        });
        if (!probe.ok) {
          void act('finish', { goodQty: state.quantity, scrapQty: 0 });
          return;
        }
      }
      setPanel('finish');
    } else if (a === 'hold') setPanel('hold');
    else if (a === 'release') {
      if (operator.role === 'supervisor' || operator.role === 'admin') void act('release');
      else setPanel({ override: 'release', retry: { type: 'release' } });
    } else if (a === 'photo') photoInput.current?.click();
  };

  const takePhoto = async (file: File | undefined) => {
    if (!file || !current) return;
    try {
      const blob = await resizePhoto(file);
      await engine.addPhoto({ id: newId(), code: current.code, trayNumber: current.number, blob, operatorId: operator.id });
      say('accepted', { title: t('photo.saved') });
    } catch {
      say('refused', { title: t('photo.failed') });
    }
  };

  const shown = current ? stateOf(current.number) : null;
  const texts = stationTexts(station, lang);
  const [barSlot, setBarSlot] = useState<HTMLElement | null>(null);
  const scroller = useRef<HTMLElement>(null);
  // a tray opened from the list or a scan shows from its top
  useEffect(() => {
    // (newer browsers return a promise from scrollTo: never hand it to React as a cleanup)
    void scroller.current?.scrollTo?.({ top: 0 });
  }, [current?.number]);

  return (
    <div className="flex h-dvh flex-col overflow-hidden">
      <header className="flex shrink-0 flex-wrap items-center gap-x-3 gap-y-1 bg-harbour-800 px-3 py-2 text-white">
        <div className="min-w-0 flex-[1_1_14rem]">
          {t(`kind.${station.kind}`) !== texts.name && <p className="text-sm">{t(`kind.${station.kind}`)}</p>}
          <p className="text-2xl font-bold leading-tight break-words" data-testid="station-name">
            {texts.name}
          </p>
        </div>
        <div className="ml-auto flex shrink-0 items-center gap-2">
          <NetStatus status={status} lang={lang} />
          <button
            type="button"
            onClick={onSwitch}
            className="flex min-h-12 items-center gap-2 rounded-xl px-2 text-left hover:bg-harbour-700"
            aria-label={`${t('top.switch')}: ${operator.name}`}
          >
            <Users className="h-6 w-6 shrink-0" aria-hidden />
            <span>
              <span className="block text-xs">{t('top.switch')}</span>
              <span className="block font-bold" data-testid="operator-name">
                {operator.name}
              </span>
            </span>
          </button>
          <button
            type="button"
            onClick={onToggleLang}
            lang={lang === 'en' ? 'zh-CN' : 'en'}
            className="flex min-h-12 items-center gap-1 whitespace-nowrap rounded-xl px-2 font-bold hover:bg-harbour-700"
            aria-label={`${t('app.language')}: ${lang === 'en' ? t('app.chinese') : t('app.english')}`}
          >
            <Languages className="h-6 w-6 shrink-0" aria-hidden /> {lang === 'en' ? t('app.chinese') : t('app.english')}
          </button>
          <button
            type="button"
            onClick={onSignOut}
            className="flex min-h-12 items-center gap-1 whitespace-nowrap rounded-xl px-2 font-bold hover:bg-harbour-700"
          >
            <LogOut className="h-6 w-6 shrink-0" aria-hidden /> {t('top.signOut')}
          </button>
        </div>
      </header>
      {idle.secondsLeft != null && (
        <div role="alert" className="flex items-center justify-between gap-3 bg-warn-50 px-4 py-3 text-xl font-bold text-warn-700">
          {t('top.idleSoon', { seconds: idle.secondsLeft })}
          <button type="button" onClick={idle.stay} className="min-h-12 rounded-xl bg-white px-4 ring-2 ring-warn-700">
            {t('top.stay')}
          </button>
        </div>
      )}
      {!status.online && <p className="shrink-0 bg-warn-50 px-4 py-1 text-lg text-warn-700">{t('net.offlineNote')}</p>}
      {status.unpaired && (
        <p role="alert" className="shrink-0 bg-stop-50 px-4 py-2 text-lg font-bold text-stop-700">
          {t('net.unpaired')}
        </p>
      )}
      <FeedbackZone feedback={feedback} onOverride={askOverride} onSendAnyway={(c) => void sendAnyway(c)} />
      <ActionBarSlot.Provider value={barSlot}>
        <main ref={scroller} className="grid min-h-0 flex-1 content-start gap-4 overflow-y-auto p-4 lg:grid-cols-[3fr_2fr]">
          <div className="flex flex-col gap-4">
            {refusedUnseen.length > 0 && <RefusedPanel entries={refusedUnseen} lang={lang} reasonName={reasonName} onSeen={(id) => void engine.markSeen(id)} />}
            {current && shown ? (
              <TrayPanel
                number={current.number}
                card={shown.card}
                state={shown.state}
                station={station}
                lang={lang}
                reasonName={reasonName}
                now={now}
                onAction={onAction}
                onClose={() => (setCurrent(null), setPanel(null))}
                panelOpen={panel !== null}
              >
                {panel === 'finish' && (
                  <FinishPanel
                    key={current.number}
                    quantity={shown.state?.quantity ?? null}
                    reasons={reasons.filter((r) => !r.stationKind || r.stationKind === station.kind)}
                    lang={lang}
                    onCancel={() => setPanel(null)}
                    onConfirm={(c: FinishCounts) => void act('finish', c, finishOverride ?? undefined).then(() => setFinishOverride(null))}
                  />
                )}
                {panel === 'hold' && <HoldPanel reasons={reasons} lang={lang} onCancel={() => setPanel(null)} onConfirm={(r) => void act('hold', r)} />}
                {panel && typeof panel === 'object' && (
                  <OverridePanel
                    kind={panel.override}
                    code={current.code}
                    stationId={station.id}
                    online={status.online}
                    onCancel={() => setPanel(null)}
                    onApproved={(ov) => {
                      const { type, ...extra } = panel.retry;
                      if (type === 'finish') {
                        setFinishOverride({ id: ov.id, kind: panel.override });
                        setPanel('finish');
                      } else void act(type, extra, { id: ov.id, kind: panel.override });
                    }}
                  />
                )}
              </TrayPanel>
            ) : (
              <section aria-labelledby="scan-title" className="flex flex-col gap-4 rounded-2xl bg-white p-5 shadow-sm">
                <h1 id="scan-title" className="flex items-center gap-3 text-4xl font-bold text-harbour-900">
                  <ScanLine className="h-12 w-12" aria-hidden /> {t('scan.prompt')}
                </h1>
                <p className="text-xl text-harbour-700">{t('scan.hint')}</p>
                {camera && <CameraScanner onScan={(text) => void openCode(text)} />}
                <div className="flex flex-wrap gap-3">
                  <button
                    type="button"
                    onClick={() => setCamera((c) => !c)}
                    className="flex min-h-16 items-center gap-3 rounded-2xl bg-harbour-800 px-6 text-xl font-bold text-white"
                  >
                    {camera ? <CameraOff className="h-7 w-7" aria-hidden /> : <Camera className="h-7 w-7" aria-hidden />}
                    {camera ? t('scan.cameraStop') : t('scan.camera')}
                  </button>
                </div>
                <form
                  className="flex flex-wrap items-end gap-3"
                  onSubmit={(e) => {
                    e.preventDefault();
                    if (typed.trim()) void openCode(typed);
                    setTyped('');
                  }}
                >
                  <div className="flex flex-col gap-1">
                    <label htmlFor="tray-number" className="flex items-center gap-2 text-lg font-bold">
                      <Keyboard className="h-5 w-5" aria-hidden /> {t('scan.type')}
                    </label>
                    <input
                      id="tray-number"
                      autoComplete="off"
                      value={typed}
                      onChange={(e) => setTyped(e.target.value)}
                      className="min-h-16 w-64 rounded-xl border-2 border-harbour-800 px-3 font-mono text-2xl uppercase"
                    />
                  </div>
                  <button type="submit" className="min-h-16 rounded-2xl bg-white px-6 text-xl font-bold text-harbour-800 ring-2 ring-harbour-800">
                    {t('scan.typeSubmit')}
                  </button>
                </form>
              </section>
            )}
          </div>
          <aside className="flex flex-col gap-4">
            <QueueLists
              inProcess={lists.inProcess}
              curing={lists.curing}
              waiting={lists.waiting}
              onOpen={(n) => void openCode(n)}
              isOven={cures(station.kind)}
              reasonName={reasonName}
            />
          </aside>
        </main>
      </ActionBarSlot.Provider>
      {current && (
        <footer
          aria-label={t('action.bar', { number: current.number })}
          data-testid="action-bar"
          className="flex shrink-0 flex-wrap items-center gap-3 border-t-4 border-harbour-800 bg-harbour-50 px-4 py-3"
        >
          <p className="shrink-0 font-mono text-3xl font-bold text-harbour-900" data-testid="bar-tray-number">
            {current.number}
          </p>
          <div ref={setBarSlot} className="flex min-w-0 flex-[1_1_32rem] flex-wrap gap-3" />
        </footer>
      )}
      <input
        ref={photoInput}
        type="file"
        accept="image/*"
        capture="environment"
        className="hidden"
        aria-hidden
        tabIndex={-1}
        onChange={(e) => void takePhoto(e.target.files?.[0]).finally(() => (e.target.value = ''))}
      />
    </div>
  );
}
