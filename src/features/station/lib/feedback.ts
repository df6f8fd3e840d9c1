// Tones made with the Web Audio API (no sound files to fetch) and vibration where the device has
// it. Three clearly different patterns: accepted (two rising beeps), warning (two level mid
// beeps), refused (a low double buzz). The words and icon on screen always say the same thing.

export type FeedbackKind = 'accepted' | 'warning' | 'refused';

interface Tone {
  freq: number;
  start: number;
  duration: number;
  type: OscillatorType;
}

export const TONES: Record<FeedbackKind, Tone[]> = {
  accepted: [
    { freq: 880, start: 0, duration: 0.09, type: 'sine' },
    { freq: 1320, start: 0.11, duration: 0.12, type: 'sine' },
  ],
  warning: [
    { freq: 660, start: 0, duration: 0.15, type: 'triangle' },
    { freq: 660, start: 0.22, duration: 0.15, type: 'triangle' },
  ],
  refused: [
    { freq: 196, start: 0, duration: 0.28, type: 'square' },
    { freq: 196, start: 0.36, duration: 0.28, type: 'square' },
  ],
};

export const VIBRATION: Record<FeedbackKind, number[]> = {
  accepted: [60],
  warning: [120, 80, 120],
  refused: [300, 120, 300],
};

let context: AudioContext | null = null;

function audio(): AudioContext | null {
  if (typeof window === 'undefined') return null;
  const Ctor = window.AudioContext ?? (window as unknown as { webkitAudioContext?: typeof AudioContext }).webkitAudioContext;
  if (!Ctor) return null;
  context ??= new Ctor();
  if (context.state === 'suspended') void context.resume();
  return context;
}

/** Browsers start audio only after a touch or key press: call this from the first one. */
export function unlockAudio() {
  audio();
}

export function playFeedback(kind: FeedbackKind) {
  try {
    const ctx = audio();
    if (ctx) {
      const t0 = ctx.currentTime + 0.01;
      for (const tone of TONES[kind]) {
        const osc = ctx.createOscillator();
        const gain = ctx.createGain();
        osc.type = tone.type;
        osc.frequency.value = tone.freq;
        // short ramps avoid clicks
        gain.gain.setValueAtTime(0.0001, t0 + tone.start);
        gain.gain.exponentialRampToValueAtTime(0.35, t0 + tone.start + 0.01);
        gain.gain.exponentialRampToValueAtTime(0.0001, t0 + tone.start + tone.duration);
        osc.connect(gain).connect(ctx.destination);
        osc.start(t0 + tone.start);
        osc.stop(t0 + tone.start + tone.duration + 0.02);
      }
    }
  } catch {
    // sound is a help, never a requirement
  }
  try {
    if (typeof navigator !== 'undefined' && 'vibrate' in navigator) navigator.vibrate(VIBRATION[kind]);
  } catch {
    // no vibration motor
  }
  if (typeof document !== 'undefined') document.body.dataset.lastFeedback = kind;
}
