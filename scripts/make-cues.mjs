#!/usr/bin/env node
/*
 * Makes table mode's audio cues: `node scripts/make-cues.mjs [out-dir]` (default public/cues).
 *
 * Every sound is synthesised here, sample by sample, so the files are our own and can be remade or changed
 * by editing a line below. No randomness: the same script always writes the same bytes, which lets a test
 * check that the files in public/cues are exactly what this script makes.
 *
 * Format: 16-bit PCM, mono, 22050 Hz WAV. Cues are short and sit in the 200 Hz – 3 kHz band, where a tablet's
 * small speaker is loudest; 22050 Hz keeps the files small and still carries that band.
 *
 * Each cue differs in pitch AND rhythm, so a therapist with eyes on the limb can tell them apart even in a
 * noisy room: rising for a start, falling for an end, a dry tick for the last seconds, a low insistent
 * two-tone for back to cold, a repeated call for "the therapist must confirm".
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const sampleRate = 22050;
// -3 dBFS leaves room so several partials never clip after normalising.
const peak = 0.7;

/** A struck bell: a few slightly inharmonic partials, each dying away faster than the one below it. */
function bell(frequency, seconds, { decay = 4, brightness = 1 } = {}) {
  const partials = [
    { ratio: 1, gain: 1, decay: 1 },
    { ratio: 2.0, gain: 0.45 * brightness, decay: 1.6 },
    { ratio: 2.76, gain: 0.25 * brightness, decay: 2.4 },
    { ratio: 5.4, gain: 0.1 * brightness, decay: 3.5 },
  ];
  const n = Math.round(seconds * sampleRate);
  const out = new Float64Array(n);
  const attack = 0.005 * sampleRate;
  for (let i = 0; i < n; i++) {
    const t = i / sampleRate;
    // A 5 ms attack: an instant start clicks on cheap speakers.
    const rise = Math.min(1, i / attack);
    let v = 0;
    for (const p of partials) {
      if (frequency * p.ratio >= sampleRate / 2) continue;
      v += p.gain * Math.exp(-decay * p.decay * t) * Math.sin(2 * Math.PI * frequency * p.ratio * t);
    }
    out[i] = v * rise;
  }
  return out;
}

/** A dry woodblock-like tick: a high tone and a lower body, both gone within a few tens of milliseconds. */
function tick(seconds) {
  const n = Math.round(seconds * sampleRate);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / sampleRate;
    const rise = Math.min(1, i / (0.001 * sampleRate));
    out[i] = rise * (Math.exp(-90 * t) * Math.sin(2 * Math.PI * 1900 * t) + 0.6 * Math.exp(-60 * t) * Math.sin(2 * Math.PI * 950 * t));
  }
  return out;
}

/**
 * A low, reedy tone (odd harmonics, like a soft square wave): unlike every bell here, so back to cold is
 * recognised at once and never mistaken for the end of a step.
 */
function reed(frequency, seconds) {
  const n = Math.round(seconds * sampleRate);
  const out = new Float64Array(n);
  const edge = 0.015 * sampleRate;
  for (let i = 0; i < n; i++) {
    const t = i / sampleRate;
    const envelope = Math.min(1, i / edge, (n - i) / edge);
    let v = 0;
    for (const h of [1, 3, 5, 7]) v += Math.sin(2 * Math.PI * frequency * h * t) / h;
    out[i] = envelope * v;
  }
  return out;
}

/** Places sounds on a timeline (start in seconds) and mixes them. */
function mix(totalSeconds, parts) {
  const out = new Float64Array(Math.round(totalSeconds * sampleRate));
  for (const { at, sound, gain = 1 } of parts) {
    const offset = Math.round(at * sampleRate);
    for (let i = 0; i < sound.length && offset + i < out.length; i++) out[offset + i] += gain * sound[i];
  }
  return out;
}

function toWav(samples) {
  let max = 0;
  for (const v of samples) max = Math.max(max, Math.abs(v));
  const scale = max === 0 ? 0 : peak / max;
  // A 10 ms fade at the very end: a cut-off bell tail would click.
  const fade = Math.round(0.01 * sampleRate);
  const data = Buffer.alloc(samples.length * 2);
  for (let i = 0; i < samples.length; i++) {
    const tail = Math.min(1, (samples.length - 1 - i) / fade);
    const v = Math.max(-1, Math.min(1, samples[i] * scale * tail));
    data.writeInt16LE(Math.round(v * 32767), i * 2);
  }
  const header = Buffer.alloc(44);
  header.write('RIFF', 0, 'ascii');
  header.writeUInt32LE(36 + data.length, 4);
  header.write('WAVE', 8, 'ascii');
  header.write('fmt ', 12, 'ascii');
  header.writeUInt32LE(16, 16); // fmt chunk size
  header.writeUInt16LE(1, 20); // PCM
  header.writeUInt16LE(1, 22); // mono
  header.writeUInt32LE(sampleRate, 24);
  header.writeUInt32LE(sampleRate * 2, 28); // byte rate
  header.writeUInt16LE(2, 32); // block align
  header.writeUInt16LE(16, 34); // bits per sample
  header.write('data', 36, 'ascii');
  header.writeUInt32LE(data.length, 40);
  return Buffer.concat([header, data]);
}

// Notes in Hz (equal temperament, A4 = 440).
const C5 = 523.25, E5 = 659.25, G5 = 783.99, A5 = 880, C6 = 1046.5, E6 = 1318.5;
const A3 = 220, E3 = 164.81;

export const cues = {
  // Rising fourth-then-fifth: "go".
  'step-start': () => mix(0.5, [
    { at: 0, sound: bell(C5, 0.25, { decay: 9 }) },
    { at: 0.14, sound: bell(G5, 0.36, { decay: 7 }) },
  ]),
  // Two soft, even strokes on one mid note: a reminder, not an alarm.
  'one-minute': () => mix(0.55, [
    { at: 0, sound: bell(A5, 0.25, { decay: 10, brightness: 0.6 }), gain: 0.8 },
    { at: 0.22, sound: bell(A5, 0.33, { decay: 9, brightness: 0.6 }), gain: 0.8 },
  ]),
  // Played once a second for the last five seconds, so it must be short and dry.
  'final-five': () => tick(0.06),
  // Falling triad: "stop".
  'step-end': () => mix(0.8, [
    { at: 0, sound: bell(G5, 0.3, { decay: 8 }) },
    { at: 0.16, sound: bell(E5, 0.3, { decay: 8 }) },
    { at: 0.32, sound: bell(C5, 0.48, { decay: 6 }) },
  ]),
  // Rising arpeggio that rings out: the only long cue, heard once per run.
  'run-complete': () => mix(1.2, [
    { at: 0, sound: bell(C5, 0.3, { decay: 7 }) },
    { at: 0.13, sound: bell(E5, 0.3, { decay: 7 }) },
    { at: 0.26, sound: bell(G5, 0.3, { decay: 7 }) },
    { at: 0.39, sound: bell(C6, 0.81, { decay: 3.5 }) },
    { at: 0.39, sound: bell(E6, 0.81, { decay: 4.5, brightness: 0.4 }), gain: 0.35 },
  ]),
  // Low, reedy, falling two-tone said twice: nothing else in the set sounds like it.
  'back-to-cold': () => mix(1.1, [
    { at: 0, sound: reed(A3, 0.22) },
    { at: 0.25, sound: reed(E3, 0.22) },
    { at: 0.55, sound: reed(A3, 0.22) },
    { at: 0.8, sound: reed(E3, 0.28) },
  ]),
  // A high call repeated in two pairs: insistent, "come and confirm".
  'needs-you': () => mix(0.8, [
    { at: 0, sound: bell(C6, 0.12, { decay: 16 }) },
    { at: 0.12, sound: bell(C6, 0.16, { decay: 16 }) },
    { at: 0.4, sound: bell(C6, 0.12, { decay: 16 }) },
    { at: 0.52, sound: bell(C6, 0.28, { decay: 12 }) },
  ]),
};

function main() {
  const here = dirname(fileURLToPath(import.meta.url));
  const outDir = resolve(process.argv[2] ?? join(here, '..', 'public', 'cues'));
  mkdirSync(outDir, { recursive: true });
  let total = 0;
  for (const [name, make] of Object.entries(cues)) {
    const wav = toWav(make());
    writeFileSync(join(outDir, `${name}.wav`), wav);
    total += wav.length;
    console.log(`${name}.wav  ${(wav.length / 1024).toFixed(1)} KB`);
  }
  console.log(`total  ${(total / 1024).toFixed(1)} KB in ${outDir}`);
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main();
