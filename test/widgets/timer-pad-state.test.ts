import { describe, expect, it } from 'vitest';
import {
  captureFailed,
  captured,
  clicked,
  initialPadState,
  intervalRefused,
  listenFailed,
  listenStarted,
  listenStarting,
  listenStopped,
  modeSwitched,
  openPressGate,
  padDisabled,
  pressed,
  releaseHeard,
  tapMark,
  withProblem,
  type PadState,
} from '../../src/widgets/timer-pad-state';
import { describePadProblem, formatSeconds, listeningText } from '../../src/widgets/timer-pad-text';
import { soundTravelFor } from '../../src/widgets/timer-pad-microphone';
import { FALL_TIME_LIMITS_S } from '../../src/timing';

const timing = (): PadState => tapMark(initialPadState(), 'release', 1000).state;

describe('the timer pad state machine: taps', () => {
  it('starts timing at the Release mark and gives the fall time at the Impact mark, with both marks as the raw capture', () => {
    const started = timing();
    expect(started).toMatchObject({ phase: 'timing', releaseAt: 1000, problem: null, message: 'Timing: tap Impact when it lands.' });
    const { state, capture } = tapMark(started, 'impact', 3250);
    // (3250 − 1000) ms = 2.25 s: the difference of the two marks.
    expect(capture).toEqual({ time_s: 2.25, raw: { kind: 'taps', timestamps_ms: [1000, 3250] } });
    expect(state.releaseAt).toBeNull();
    // Done is reached once the element has shown the time: captured() is the step that says so.
    expect(captured(state, capture!.time_s, '2.250')).toMatchObject({ phase: 'done', time: 2.25, problem: null, message: 'Fall time 2.250 s captured.' });
  });

  it('refuses an Impact with no Release before it, and changes nothing else', () => {
    const before = initialPadState();
    const { state, capture } = tapMark(before, 'impact', 500);
    expect(capture).toBeNull();
    expect(state).toEqual({ ...before, problem: 'Tap Release first, at the moment the specimen is let go.' });
  });

  it('refuses a fall time outside the allowed range, naming it, and goes back to ready', () => {
    const tooLong = FALL_TIME_LIMITS_S.max * 1000 + 1000;
    const { state, capture } = tapMark(timing(), 'impact', 1000 + tooLong);
    expect(capture).toBeNull();
    expect(state.phase).toBe('ready');
    expect(state.releaseAt).toBeNull();
    expect(state.message).toBe('');
    expect(state.problem).toMatch(/^Fall time: \d+ s is .+\. Allowed: /);
  });

  it('refuses an Impact mark before the Release mark', () => {
    const { state, capture } = tapMark(timing(), 'impact', 900);
    expect(capture).toBeNull();
    expect(state.problem).toMatch(/^Fall time: The impact tap is .+ before the release tap\. Allowed: /);
  });

  it('a second Release restarts the timing from the new mark', () => {
    const again = tapMark(timing(), 'release', 1800).state;
    expect(again.releaseAt).toBe(1800);
    expect(tapMark(again, 'impact', 2800).capture?.time_s).toBe(1);
  });

  it('switching mode abandons a half-done timing; disabling keeps a captured time', () => {
    expect(modeSwitched({ ...timing(), problem: 'x', message: 'y' })).toMatchObject({ phase: 'ready', releaseAt: null, problem: null, message: '' });
    expect(padDisabled(timing())).toMatchObject({ phase: 'ready', releaseAt: null });
    const done = captured(initialPadState(), 1.5, '1.500');
    expect(padDisabled(done)).toMatchObject({ phase: 'done', time: 1.5 });
  });
});

describe('the timer pad press gate', () => {
  it('takes the press as the mark and ignores the click that follows it', () => {
    const gate = pressed(openPressGate(), 'release');
    const first = clicked(gate, 'release');
    expect(first.mark).toBe(false);
    expect(first.gate).toEqual(openPressGate());
  });

  it('takes a click with no press before it (assistive technology) as the mark', () => {
    expect(clicked(openPressGate(), 'impact')).toEqual({ gate: openPressGate(), mark: true });
    // A press on one target does not swallow a click on the other.
    expect(clicked(pressed(openPressGate(), 'release'), 'impact').mark).toBe(true);
  });
});

describe('the timer pad state machine: listening', () => {
  it('goes from starting to listening, and says whether sound travel is corrected', () => {
    const starting = listenStarting({ ...initialPadState(), problem: 'old' });
    expect(starting).toMatchObject({ phase: 'starting', problem: null, message: 'Opening the microphone…' });
    expect(listenStarted(starting, false, null).message).toBe('Listening: make the release sound, then let it land.');
    expect(listenStarted(starting, true, null).message).toBe('Listening: make the release sound, then let it land. Corrected for sound travel.');
    expect(listenStarted(starting, true, 20).message).toBe(
      'Listening: make the release sound, then let it land. Corrected for sound travel (speed of sound at 20 °C assumed).',
    );
    expect(listenStarted(starting, true, 20).phase).toBe('listening');
  });

  it('back to ready when the microphone cannot open, or to the last time when listening stops or fails', () => {
    expect(listenFailed(listenStarting(initialPadState()), new Error('Permission denied'))).toMatchObject({ phase: 'ready', message: '', problem: 'Permission denied' });
    expect(listenStopped(listenStarted(initialPadState(), false, null))).toMatchObject({ phase: 'ready', message: 'Stopped listening.' });
    const withTime = { ...captured(initialPadState(), 2, '2.000'), phase: 'listening' as const };
    expect(listenStopped(withTime).phase).toBe('done');
    expect(captureFailed(withTime, new Error('The microphone was taken away'))).toMatchObject({ phase: 'done', message: '', problem: 'The microphone was taken away' });
  });

  it('reports the release heard, and an unusable pair while it keeps listening', () => {
    const listening = listenStarted(initialPadState(), false, null);
    expect(releaseHeard(listening).message).toBe('Release heard: waiting for the impact…');
    const refused = intervalRefused(listening, new Error('Only one sound heard.'));
    expect(refused).toMatchObject({ phase: 'listening', problem: 'Only one sound heard. Still listening: drop again.', message: 'Listening: make the release sound, then let it land.' });
    expect(withProblem(listening, 'plain words').problem).toBe('plain words');
  });
});

describe('the timer pad wording and sound-travel set-up', () => {
  it('names the field, the value and the allowed range of a refused sound-travel distance', () => {
    let error: unknown = null;
    try {
      soundTravelFor({ releaseDistance: -3, landingDistance: 2, airTemperature: 15, releaseHeight: 10 });
    } catch (e) {
      error = e;
    }
    expect(error).not.toBeNull();
    expect(describePadProblem(error)).toMatch(/^Distance to the release point: -3 m is out of range\. Allowed: /);
  });

  it('has no sound-travel set-up without both distances, and assumes 20 °C without a temperature', () => {
    expect(soundTravelFor({ releaseDistance: 3, landingDistance: null, airTemperature: 15, releaseHeight: 10 })).toBeNull();
    const assumed = soundTravelFor({ releaseDistance: 12, landingDistance: 2, airTemperature: null, releaseHeight: 10 });
    const at20 = soundTravelFor({ releaseDistance: 12, landingDistance: 2, airTemperature: 20, releaseHeight: 10 });
    // The same speed of sound; the record keeps that the temperature was assumed (null), not measured.
    expect(assumed).toEqual({ ...at20, temperature_C: null });
    expect(at20?.temperature_C).toBe(20);
    expect(assumed?.distance_to_release_m).toBe(12);
  });

  it('shows seconds with a decimal comma where chosen', () => {
    expect(formatSeconds(1.23456, false)).toBe('1.235');
    expect(formatSeconds(1.23456, true)).toBe('1,235');
    expect(formatSeconds(0.5, true, 1)).toBe('0,5');
    expect(listeningText(false, 20)).toBe('Listening: make the release sound, then let it land.');
  });
});
