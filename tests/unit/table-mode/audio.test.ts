import { createCuePlayer, createRecordingCuePlayer, type CuePlayed } from '../../../src/features/table-mode/lib/audio';

/** A stand-in for howler: records what the audio module asks of it and lets the test fire its events. */
const fake = vi.hoisted(() => {
  type Listener = { fn: () => void; id?: number };
  class FakeHowl {
    static made: FakeHowl[] = [];
    static nextId = 1;
    src: string[];
    volumeValue: number;
    muted: boolean;
    plays: number[] = [];
    listeners: Record<string, Listener[]> = {};
    constructor(options: { src: string[]; volume: number; mute: boolean }) {
      this.src = options.src;
      this.volumeValue = options.volume;
      this.muted = options.mute;
      FakeHowl.made.push(this);
    }
    play() {
      const id = FakeHowl.nextId++;
      this.plays.push(id);
      return id;
    }
    once(event: string, fn: () => void, id?: number) {
      (this.listeners[event] ??= []).push({ fn, id });
      return this;
    }
    off(event: string, fn: () => void, id?: number) {
      this.listeners[event] = (this.listeners[event] ?? []).filter((l) => !(l.fn === fn && l.id === id));
      return this;
    }
    emit(event: string, id: number) {
      const matching = (this.listeners[event] ?? []).filter((l) => l.id === id);
      this.listeners[event] = (this.listeners[event] ?? []).filter((l) => l.id !== id);
      matching.forEach((l) => l.fn());
    }
    listenerCount() {
      return Object.values(this.listeners).reduce((n, list) => n + list.length, 0);
    }
    volume(v: number) {
      this.volumeValue = v;
    }
    mute(m: boolean) {
      this.muted = m;
    }
  }
  const Howler = { autoSuspend: true, ctx: { state: 'suspended', resume: vi.fn(async () => undefined) } };
  return { FakeHowl, Howler };
});

vi.mock('howler', () => ({ Howl: fake.FakeHowl, Howler: fake.Howler }));

const howlFor = (cue: string) => fake.FakeHowl.made.find((h) => h.src[0] === `/cues/${cue}.wav`)!;

function fakeSpeech(voices: number) {
  const spoken: { text: string; volume: number }[] = [];
  const synth = {
    getVoices: () => Array.from({ length: voices }, (_, i) => ({ name: `voice ${i}` })),
    speak: vi.fn((u: { text: string; volume: number }) => spoken.push({ text: u.text, volume: u.volume })),
    cancel: vi.fn(),
  };
  vi.stubGlobal('window', { speechSynthesis: synth });
  vi.stubGlobal(
    'SpeechSynthesisUtterance',
    class {
      volume = 1;
      constructor(public text: string) {}
    },
  );
  return { synth, spoken };
}

beforeEach(() => {
  fake.FakeHowl.made = [];
  fake.Howler.autoSuspend = true;
  fake.Howler.ctx.state = 'suspended';
  fake.Howler.ctx.resume.mockClear();
});
afterEach(() => vi.unstubAllGlobals());

describe('the cue player', () => {
  it('reports a cue when howler says it started, with the time it was due and the time it fired', () => {
    let clock = 1000;
    const player = createCuePlayer({ now: () => clock });
    const heard: CuePlayed[] = [];
    player.onPlayed((played) => heard.push(played));

    player.play('step-end', { scheduledAt: 990 });
    clock = 1042;
    expect(heard).toEqual([]);
    const howl = howlFor('step-end');
    howl.emit('play', howl.plays[0]);

    expect(heard).toEqual([{ cue: 'step-end', scheduledAt: 990, firedAt: 1042 }]);
  });

  it('a sound the browser blocks is not reported, and leaves no listener behind', () => {
    const player = createCuePlayer({ now: () => 5 });
    const heard = vi.fn();
    player.onPlayed(heard);

    player.play('needs-you');
    const howl = howlFor('needs-you');
    howl.emit('playerror', howl.plays[0]);

    expect(heard).not.toHaveBeenCalled();
    expect(howl.listenerCount()).toBe(0);
  });

  it('stops reporting to a listener that unsubscribed', () => {
    const player = createCuePlayer({ now: () => 5 });
    const heard = vi.fn();
    const unsubscribe = player.onPlayed(heard);

    unsubscribe();
    player.play('final-five');
    const howl = howlFor('final-five');
    howl.emit('play', howl.plays[0]);

    expect(heard).not.toHaveBeenCalled();
  });

  it('unlocking keeps the audio context awake, resumes it and loads every cue from /cues/', () => {
    const player = createCuePlayer();

    player.unlock();

    expect(fake.Howler.autoSuspend).toBe(false);
    expect(fake.Howler.ctx.resume).toHaveBeenCalledTimes(1);
    expect(fake.FakeHowl.made.map((h) => h.src[0]).sort()).toEqual(
      ['back-to-cold', 'final-five', 'needs-you', 'one-minute', 'run-complete', 'step-end', 'step-start'].map((c) => `/cues/${c}.wav`),
    );
  });

  it('volume and mute reach the sounds already loaded and those loaded later', () => {
    const player = createCuePlayer({ volume: 0.4 });
    player.play('step-start');

    player.setVolume(1.7);
    player.setMuted(true);
    player.play('one-minute');

    expect([howlFor('step-start').volumeValue, howlFor('step-start').muted]).toEqual([1, true]);
    expect([howlFor('one-minute').volumeValue, howlFor('one-minute').muted]).toEqual([1, true]);
  });

  it('speaks the newest text at the chosen volume, dropping any still queued', () => {
    const { synth, spoken } = fakeSpeech(2);
    const player = createCuePlayer({ volume: 0.6 });

    player.speak('Cross-fibre friction, three minutes');

    expect(synth.cancel).toHaveBeenCalled();
    expect(spoken).toEqual([{ text: 'Cross-fibre friction, three minutes', volume: 0.6 }]);
  });

  it('says nothing, and does not fail, without voices, without speech, when muted or with speech off', () => {
    const noVoices = fakeSpeech(0);
    createCuePlayer().speak('Cold pack');
    expect(noVoices.synth.speak).not.toHaveBeenCalled();

    vi.unstubAllGlobals();
    expect(() => createCuePlayer().speak('Cold pack')).not.toThrow();

    const voices = fakeSpeech(1);
    createCuePlayer({ muted: true }).speak('Cold pack');
    createCuePlayer({ speak: false }).speak('Cold pack');
    const switchedOff = createCuePlayer();
    switchedOff.setSpeech(false);
    switchedOff.speak('Cold pack');
    expect(voices.synth.speak).not.toHaveBeenCalled();
  });
});

describe('the recording cue player', () => {
  it('records cues with their due times and reports them like the real one', () => {
    const player = createRecordingCuePlayer({ now: () => 2000 });
    const heard = vi.fn();
    player.onPlayed(heard);

    player.play('step-start', { scheduledAt: 1990 });
    player.play('final-five');

    expect(player.played).toEqual([
      { cue: 'step-start', scheduledAt: 1990, firedAt: 2000 },
      { cue: 'final-five', scheduledAt: 2000, firedAt: 2000 },
    ]);
    expect(heard).toHaveBeenCalledTimes(2);
  });

  it('records speech only when speech is on and not muted', () => {
    const player = createRecordingCuePlayer();

    player.speak('Cold pack');
    player.setMuted(true);
    player.speak('Compression wrap');
    player.setMuted(false);
    player.setSpeech(false);
    player.speak('Rest and re-check');

    expect(player.spoken).toEqual(['Cold pack']);
  });
});
