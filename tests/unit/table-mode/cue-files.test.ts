import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cueNames } from '../../../src/features/table-mode/lib/cue-schedule';

const cueDir = join(process.cwd(), 'public', 'cues');

function readWav(file: string) {
  const bytes = readFileSync(file);
  return {
    bytes,
    riff: bytes.toString('ascii', 0, 4),
    wave: bytes.toString('ascii', 8, 12),
    format: bytes.readUInt16LE(20),
    channels: bytes.readUInt16LE(22),
    sampleRate: bytes.readUInt32LE(24),
    bits: bytes.readUInt16LE(34),
    dataLength: bytes.readUInt32LE(40),
    samples: new Int16Array(bytes.buffer.slice(bytes.byteOffset + 44, bytes.byteOffset + bytes.length)),
  };
}

/** Sign changes per second over the loudest part: a rough pitch, enough to rank cues from low to high. */
function crossingsPerSecond(samples: Int16Array, rate: number) {
  const part = samples.subarray(0, Math.min(samples.length, Math.round(0.15 * rate)));
  let crossings = 0;
  for (let i = 1; i < part.length; i++) if (part[i - 1] < 0 !== part[i] < 0) crossings++;
  return crossings / (part.length / rate);
}

describe('the cue files', () => {
  it('there is one 16-bit mono 22050 Hz PCM WAV for every cue the schedule names, and nothing else', () => {
    expect(readdirSync(cueDir).sort()).toEqual(cueNames.map((name) => `${name}.wav`).sort());
    for (const name of cueNames) {
      const wav = readWav(join(cueDir, `${name}.wav`));
      expect([wav.riff, wav.wave, wav.format, wav.channels, wav.sampleRate, wav.bits], name).toEqual(['RIFF', 'WAVE', 1, 1, 22050, 16]);
      expect(wav.dataLength, name).toBe(wav.bytes.length - 44);
    }
  });

  it('together they stay under 300 KB, and the tick played every second lasts under a tenth of a second', () => {
    const total = cueNames.reduce((sum, name) => sum + statSync(join(cueDir, `${name}.wav`)).size, 0);
    const tick = readWav(join(cueDir, 'final-five.wav'));

    expect(total).toBeLessThan(300 * 1024);
    expect(tick.samples.length / tick.sampleRate).toBeLessThan(0.1);
  });

  it('back to cold is the lowest-pitched cue by far, so it cannot be mistaken for another', () => {
    const pitch = Object.fromEntries(
      cueNames.map((name) => {
        const wav = readWav(join(cueDir, `${name}.wav`));
        return [name, crossingsPerSecond(wav.samples, wav.sampleRate)];
      }),
    );
    const others = cueNames.filter((name) => name !== 'back-to-cold').map((name) => pitch[name]);

    expect(pitch['back-to-cold'] * 2).toBeLessThan(Math.min(...others));
  });

  it('the files are exactly what scripts/make-cues.mjs makes, so they can be remade from the script', () => {
    const out = mkdtempSync(join(tmpdir(), 'cues-'));
    try {
      execFileSync(process.execPath, [join(process.cwd(), 'scripts', 'make-cues.mjs'), out], { stdio: 'pipe' });
      for (const name of cueNames) {
        expect(readFileSync(join(out, `${name}.wav`)).equals(readFileSync(join(cueDir, `${name}.wav`))), name).toBe(true);
      }
    } finally {
      rmSync(out, { recursive: true, force: true });
    }
  });
});
