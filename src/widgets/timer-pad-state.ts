// The timer pad's states and how taps and the microphone move it between them: pure (no element, no clock;
// times are the events' own time stamps, passed in), so every transition is tested on its own.
import { fallTimeFromTaps } from '../timing';
import { PAD_TEXT, capturedText, describePadProblem, listeningText } from './timer-pad-text';

export type PadPhase = 'ready' | 'timing' | 'listening' | 'starting' | 'done';
export type PadTarget = 'release' | 'impact';

export interface PadState {
  phase: PadPhase;
  /** The Release mark (the event's time stamp, ms) while timing. */
  releaseAt: number | null;
  /** The last captured fall time, s. */
  time: number | null;
  /** What the pad says to the person (status line). */
  message: string;
  /** What went wrong, shown as an alert. */
  problem: string | null;
}

export const initialPadState = (): PadState => ({ phase: 'ready', releaseAt: null, time: null, message: '', problem: null });

/** A fall time from two taps, as the record model's raw capture keeps it. */
export interface TapCapture {
  time_s: number;
  raw: { kind: 'taps'; timestamps_ms: [number, number] };
}

/**
 * A mark on Release or Impact at `timeStamp` (ms). Release (again) starts timing; Impact without a Release is
 * refused; Impact after one gives the fall time, or the reason it is refused (out of the allowed range).
 */
export function tapMark(state: PadState, which: PadTarget, timeStamp: number): { state: PadState; capture: TapCapture | null } {
  if (which === 'release') {
    return { state: { ...state, releaseAt: timeStamp, problem: null, phase: 'timing', message: PAD_TEXT.timing }, capture: null };
  }
  if (state.releaseAt === null) return { state: { ...state, problem: PAD_TEXT.releaseFirst }, capture: null };
  const release = state.releaseAt;
  try {
    const time_s = fallTimeFromTaps(release, timeStamp);
    return { state: { ...state, releaseAt: null }, capture: { time_s, raw: { kind: 'taps', timestamps_ms: [release, timeStamp] } } };
  } catch (error) {
    return { state: { ...state, releaseAt: null, phase: 'ready', message: '', problem: describePadProblem(error) }, capture: null };
  }
}

/** A fall time was captured (by taps or by ear); `shown` is the time as the pad prints it. */
export function captured(state: PadState, time_s: number, shown: string): PadState {
  return { ...state, time: time_s, phase: 'done', problem: null, message: capturedText(shown) };
}

/** Switching between Tap and Listen abandons what was half done in the other mode. */
export function modeSwitched(state: PadState): PadState {
  return { ...state, releaseAt: null, phase: 'ready', problem: null, message: '' };
}

/** The pad was disabled: a half-done timing is dropped, a captured time stays shown. */
export function padDisabled(state: PadState): PadState {
  return { ...state, releaseAt: null, phase: state.phase === 'done' ? 'done' : 'ready' };
}

export function withProblem(state: PadState, error: unknown): PadState {
  return { ...state, problem: describePadProblem(error) };
}

export function listenStarting(state: PadState): PadState {
  return { ...state, problem: null, phase: 'starting', message: PAD_TEXT.opening };
}

/** The microphone is open. `assumedTemperature_C` is set when sound travel is corrected at an assumed temperature. */
export function listenStarted(state: PadState, corrected: boolean, assumedTemperature_C: number | null): PadState {
  return { ...state, phase: 'listening', message: listeningText(corrected, assumedTemperature_C) };
}

export function listenFailed(state: PadState, error: unknown): PadState {
  return { ...state, phase: 'ready', message: '', problem: describePadProblem(error) };
}

/** Listening stopped by the person (or the capture failed): back to the last time, if there is one. */
export function listenStopped(state: PadState): PadState {
  return { ...state, phase: state.time === null ? 'ready' : 'done', message: PAD_TEXT.stopped };
}

export function captureFailed(state: PadState, error: unknown): PadState {
  return { ...state, phase: state.time === null ? 'ready' : 'done', message: '', problem: describePadProblem(error) };
}

export function releaseHeard(state: PadState): PadState {
  return { ...state, message: PAD_TEXT.releaseHeard };
}

/** The microphone heard a pair it cannot use: say why and keep listening. */
export function intervalRefused(state: PadState, problem: unknown): PadState {
  return { ...state, problem: `${describePadProblem(problem)} ${PAD_TEXT.dropAgain}`, message: PAD_TEXT.listenPrompt };
}

/**
 * Which presses are marks. The press itself (pointerdown or keydown) is the mark; the click that follows it on
 * release of the finger is not a second one; a click with no press before it comes from assistive technology
 * and is the mark.
 */
export interface PressGate {
  release: boolean;
  impact: boolean;
}

export const openPressGate = (): PressGate => ({ release: false, impact: false });

export function pressed(gate: PressGate, which: PadTarget): PressGate {
  return { ...gate, [which]: true };
}

export function clicked(gate: PressGate, which: PadTarget): { gate: PressGate; mark: boolean } {
  if (gate[which]) return { gate: { ...gate, [which]: false }, mark: false };
  return { gate, mark: true };
}
