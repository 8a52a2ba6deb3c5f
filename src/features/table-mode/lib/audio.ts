import { Howl, Howler } from 'howler';
import { cueNames, type CueName } from './cue-schedule';

/*
 * Table mode's sounds: the cue files in public/cues (made by scripts/make-cues.mjs) played through howler,
 * and the step names spoken when the browser can speak. Everything else in table mode talks to the
 * CuePlayer interface, so tests and jsdom (which has no media playback) use the recording fake below.
 */

export interface CuePlayed {
  cue: CueName;
  /** When the cue was due (or, without one, when play was called), ms since the epoch. */
  scheduledAt: number;
  /** When howler reported the sound playing. */
  firedAt: number;
}

export interface CuePlayer {
  /** Call from the tap that begins the run: browsers only let audio start from a user gesture. */
  unlock(): void;
  play(cue: CueName, options?: { scheduledAt?: number }): void;
  setVolume(volume: number): void;
  setMuted(muted: boolean): void;
  /** Turns spoken step names on or off. */
  setSpeech(enabled: boolean): void;
  /** Says the text if the browser can; never waits and never fails. */
  speak(text: string): void;
  /** Hears each cue as it actually starts, so cue timing can be measured end to end. Returns the unsubscribe. */
  onPlayed(listener: (played: CuePlayed) => void): () => void;
}

export interface CuePlayerOptions {
  /** 0 to 1. */
  volume?: number;
  muted?: boolean;
  /** Speak step names. */
  speak?: boolean;
  /** Where the cue files are served; defaults to the app's base URL + "cues/". */
  baseUrl?: string;
  now?: () => number;
}

const clampVolume = (volume: number) => (Number.isFinite(volume) ? Math.min(1, Math.max(0, volume)) : 1);

function speechSynthesisOrNull(): SpeechSynthesis | null {
  if (typeof window === 'undefined' || !('speechSynthesis' in window) || typeof SpeechSynthesisUtterance === 'undefined') {
    return null;
  }
  return window.speechSynthesis;
}

export function createCuePlayer(options: CuePlayerOptions = {}): CuePlayer {
  const now = options.now ?? (() => Date.now());
  const baseUrl = options.baseUrl ?? `${import.meta.env.BASE_URL}cues/`;
  let volume = clampVolume(options.volume ?? 1);
  let muted = options.muted ?? false;
  let speechOn = options.speak ?? true;
  const listeners = new Set<(played: CuePlayed) => void>();
  const howls = new Map<CueName, Howl>();

  // Loaded on first need, not at import: creating Howls touches the audio context, which must wait for a page.
  function howlFor(cue: CueName): Howl {
    let howl = howls.get(cue);
    if (!howl) {
      howl = new Howl({ src: [`${baseUrl}${cue}.wav`], preload: true, volume, mute: muted });
      howls.set(cue, howl);
    }
    return howl;
  }

  return {
    unlock() {
      // Howler suspends an idle context after 30 s; resuming it later adds delay to a cue and, on some
      // tablets, fails outside a gesture. Cues minutes apart in a long run would meet exactly that.
      Howler.autoSuspend = false;
      const ctx = Howler.ctx as AudioContext | null | undefined;
      if (ctx && ctx.state === 'suspended') void ctx.resume().catch(() => undefined);
      for (const cue of cueNames) howlFor(cue);
      // iOS speaks later only if speech was first used inside a gesture; an empty utterance is silent.
      const synth = speechSynthesisOrNull();
      if (synth && speechOn) {
        try {
          synth.speak(new SpeechSynthesisUtterance(''));
        } catch {
          // Speech is optional.
        }
      }
    },

    play(cue, playOptions = {}) {
      const scheduledAt = playOptions.scheduledAt ?? now();
      const howl = howlFor(cue);
      const id = howl.play();
      if (typeof id !== 'number') return;
      const onPlay = () => {
        howl.off('playerror', onError, id);
        const played: CuePlayed = { cue, scheduledAt, firedAt: now() };
        for (const listener of listeners) listener(played);
      };
      // A blocked or broken sound must not leave a listener behind for ever.
      const onError = () => howl.off('play', onPlay, id);
      howl.once('play', onPlay, id);
      howl.once('playerror', onError, id);
    },

    setVolume(next) {
      volume = clampVolume(next);
      for (const howl of howls.values()) howl.volume(volume);
    },

    setMuted(next) {
      muted = next;
      for (const howl of howls.values()) howl.mute(muted);
      if (muted) speechSynthesisOrNull()?.cancel();
    },

    setSpeech(enabled) {
      speechOn = enabled;
      if (!enabled) speechSynthesisOrNull()?.cancel();
    },

    speak(text) {
      const synth = speechSynthesisOrNull();
      if (!synth || !speechOn || muted || text.trim() === '') return;
      try {
        // No voices (headless browsers, some tablets): speak() would queue silently for ever.
        if (synth.getVoices().length === 0) return;
        // The newest step name matters; one still queued from a step already gone would mislead.
        synth.cancel();
        const utterance = new SpeechSynthesisUtterance(text);
        utterance.volume = volume;
        synth.speak(utterance);
      } catch {
        // Speech is optional.
      }
    },

    onPlayed(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export interface RecordingCuePlayer extends CuePlayer {
  /** Every cue played, with scheduledAt = firedAt (a fake plays at once). */
  readonly played: CuePlayed[];
  readonly spoken: string[];
  readonly unlocked: boolean;
  readonly volume: number;
  readonly muted: boolean;
  readonly speechOn: boolean;
}

/** A CuePlayer for tests and jsdom: records instead of sounding, and honours mute like the real one. */
export function createRecordingCuePlayer(options: Pick<CuePlayerOptions, 'volume' | 'muted' | 'speak' | 'now'> = {}): RecordingCuePlayer {
  const now = options.now ?? (() => Date.now());
  const listeners = new Set<(played: CuePlayed) => void>();
  const state = {
    played: [] as CuePlayed[],
    spoken: [] as string[],
    unlocked: false,
    volume: clampVolume(options.volume ?? 1),
    muted: options.muted ?? false,
    speechOn: options.speak ?? true,
  };
  return {
    get played() {
      return state.played;
    },
    get spoken() {
      return state.spoken;
    },
    get unlocked() {
      return state.unlocked;
    },
    get volume() {
      return state.volume;
    },
    get muted() {
      return state.muted;
    },
    get speechOn() {
      return state.speechOn;
    },
    unlock() {
      state.unlocked = true;
    },
    play(cue, playOptions = {}) {
      const firedAt = now();
      const played = { cue, scheduledAt: playOptions.scheduledAt ?? firedAt, firedAt };
      state.played.push(played);
      for (const listener of listeners) listener(played);
    },
    setVolume(volume) {
      state.volume = clampVolume(volume);
    },
    setMuted(muted) {
      state.muted = muted;
    },
    setSpeech(enabled) {
      state.speechOn = enabled;
    },
    speak(text) {
      if (state.speechOn && !state.muted && text.trim() !== '') state.spoken.push(text);
    },
    onPlayed(listener) {
      listeners.add(listener);
      return () => {
        listeners.delete(listener);
      };
    },
  };
}
