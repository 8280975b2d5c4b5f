// @vitest-environment happy-dom
import { describe, expect, expectTypeOf, it } from 'vitest';
import '../../src/widgets/timer-pad';
import { TimerPad, type TimeCapturedDetail } from '../../src/widgets/timer-pad';
import { TimingError, type CapturedInterval, type SoundCapture, type SoundCaptureOptions } from '../../src/timing';
import type { RawCapture } from '../../src/log/types';
import { h, render, type JSX } from 'preact';

async function make(props: Partial<TimerPad> = {}, tag = 'pl-timer-pad'): Promise<TimerPad> {
  const el = document.createElement(tag) as TimerPad;
  Object.assign(el, props);
  document.body.append(el);
  await el.updateComplete;
  return el;
}

function button(el: TimerPad, name: string): HTMLButtonElement {
  const found = [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim() === name);
  if (!found) throw new Error(`no button "${name}"`);
  return found;
}

/** An event whose timeStamp is the given time on the page clock (ms), as the browser would stamp it. */
function stamped<E extends Event>(event: E, timeStamp: number): E {
  Object.defineProperty(event, 'timeStamp', { value: timeStamp });
  return event;
}

const pointerDown = (target: Element, t: number, init: PointerEventInit = {}) =>
  target.dispatchEvent(stamped(new PointerEvent('pointerdown', { bubbles: true, pointerType: 'touch', ...init }), t));
const click = (target: Element, t: number) => target.dispatchEvent(stamped(new MouseEvent('click', { bubbles: true }), t));

function captures(el: TimerPad): TimeCapturedDetail[] {
  const got: TimeCapturedDetail[] = [];
  el.addEventListener('time-captured', (e) => got.push(e.detail));
  return got;
}

const text = (el: TimerPad, selector: string) => el.shadowRoot!.querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;

describe('<pl-timer-pad> tap timing', () => {
  it('is a named group with Tap/Listen switches and Release and Impact buttons', async () => {
    const el = await make({ label: 'Drop 3 timer' });
    const group = el.shadowRoot!.querySelector('[role="group"]')!;
    const title = el.shadowRoot!.getElementById(group.getAttribute('aria-labelledby')!);
    expect(title?.textContent).toBe('Drop 3 timer');
    expect(button(el, 'Tap').getAttribute('aria-pressed')).toBe('true');
    expect(button(el, 'Listen').getAttribute('aria-pressed')).toBe('false');
    expect(button(el, 'Release').type).toBe('button');
    expect(button(el, 'Impact').type).toBe('button');
  });

  it('times from the release press to the impact press and fires time-captured with the raw taps', async () => {
    const el = await make();
    const got = captures(el);
    pointerDown(button(el, 'Release'), 1000);
    click(button(el, 'Release'), 1090);
    pointerDown(button(el, 'Impact'), 2234);
    click(button(el, 'Impact'), 2301);
    expect(got).toEqual([{ time_s: 1.234, raw: { kind: 'taps', timestamps_ms: [1000, 2234] } }]);
    await el.updateComplete;
    expect(text(el, '.time')).toBe('1.234 s');
    expect(text(el, '[role="status"]')).toBe('Fall time 1.234 s captured.');
  });

  it('takes Space and Enter on the buttons, on key down, once per press', async () => {
    const el = await make({ decimalComma: true });
    const got = captures(el);
    const space = stamped(new KeyboardEvent('keydown', { key: ' ', bubbles: true, cancelable: true }), 500);
    button(el, 'Release').dispatchEvent(space);
    expect(space.defaultPrevented).toBe(true);
    // A held key repeats: the repeats are not new releases.
    button(el, 'Release').dispatchEvent(stamped(new KeyboardEvent('keydown', { key: ' ', repeat: true, bubbles: true }), 800));
    click(button(el, 'Release'), 820);
    button(el, 'Impact').dispatchEvent(stamped(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true, cancelable: true }), 1500.75));
    click(button(el, 'Impact'), 1500.8);
    expect(got.map((d) => d.raw)).toEqual([{ kind: 'taps', timestamps_ms: [500, 1500.75] }]);
    expect(got[0]!.time_s).toBeCloseTo(1.00075, 12);
    await el.updateComplete;
    expect(text(el, '.time')).toBe('1,001 s');
  });

  it('takes a click with no press before it (assistive technology) as the mark', async () => {
    const el = await make();
    const got = captures(el);
    click(button(el, 'Release'), 100);
    click(button(el, 'Impact'), 2100);
    expect(got.map((d) => d.time_s)).toEqual([2]);
  });

  it('ignores a right mouse button', async () => {
    const el = await make();
    const got = captures(el);
    pointerDown(button(el, 'Release'), 100, { pointerType: 'mouse', button: 0 });
    pointerDown(button(el, 'Impact'), 900, { pointerType: 'mouse', button: 2 });
    pointerDown(button(el, 'Impact'), 1100, { pointerType: 'mouse', button: 0 });
    expect(got.map((d) => d.time_s)).toEqual([1]);
  });

  it('restarts on a second Release press', async () => {
    const el = await make();
    const got = captures(el);
    pointerDown(button(el, 'Release'), 100);
    pointerDown(button(el, 'Release'), 5000);
    pointerDown(button(el, 'Impact'), 6500);
    expect(got.map((d) => d.raw)).toEqual([{ kind: 'taps', timestamps_ms: [5000, 6500] }]);
  });

  it('asks for Release first when Impact is tapped alone, and fires nothing', async () => {
    const el = await make();
    const got = captures(el);
    pointerDown(button(el, 'Impact'), 1000);
    await el.updateComplete;
    expect(got).toEqual([]);
    expect(text(el, '[role="alert"]')).toBe('Tap Release first, at the moment the specimen is let go.');
  });

  it('refuses a double tap, naming the time and the allowed range', async () => {
    const el = await make();
    const got = captures(el);
    pointerDown(button(el, 'Release'), 1000);
    pointerDown(button(el, 'Impact'), 1020);
    await el.updateComplete;
    expect(got).toEqual([]);
    expect(text(el, '[role="alert"]')).toBe(
      'Fall time: 0.02 s is shorter than any fall this can time (a double tap?). Allowed: a fall time from 0.05 s to 3600 s, impact after release.',
    );
    // The next drop starts clean.
    pointerDown(button(el, 'Release'), 3000);
    pointerDown(button(el, 'Impact'), 4000);
    await el.updateComplete;
    expect(got.map((d) => d.time_s)).toEqual([1]);
    expect(text(el, '[role="alert"]')).toBeNull();
  });

  it('does nothing while disabled', async () => {
    const el = await make({ disabled: true });
    const got = captures(el);
    pointerDown(button(el, 'Release'), 0);
    pointerDown(button(el, 'Impact'), 1000);
    expect(got).toEqual([]);
    expect(button(el, 'Release').disabled).toBe(true);
  });

  it('has no property whose name starts with "on" (Preact would take it for a listener)', () => {
    const names = Object.keys(TimerPad.properties);
    expect(names.length).toBeGreaterThan(5);
    expect(names.filter((n) => /^on/i.test(n))).toEqual([]);
  });

  it('gives a raw capture of the record model’s RawCapture type', () => {
    expectTypeOf<TimeCapturedDetail['raw']>().toExtend<RawCapture>();
    expectTypeOf<TimeCapturedDetail['time_s']>().toEqualTypeOf<number>();
  });
});

// A stand-in for the microphone: the pad's listening path with the intervals handed in by the test.
class FakeCapture extends EventTarget {
  started = 0;
  stopped = 0;
  failWith: Error | null = null;
  constructor(readonly options: SoundCaptureOptions) {
    super();
  }
  async start() {
    this.started++;
    if (this.failWith) throw this.failWith;
  }
  async stop() {
    this.stopped++;
  }
  interval(detail: Partial<CapturedInterval>) {
    this.dispatchEvent(new CustomEvent('sound-interval', { detail }));
  }
}

let lastCapture: FakeCapture | null = null;
class TestTimerPad extends TimerPad {
  protected override createSoundCapture(options: SoundCaptureOptions): SoundCapture {
    lastCapture = new FakeCapture(options);
    return lastCapture as unknown as SoundCapture;
  }
}
customElements.define('pl-timer-pad-test', TestTimerPad);

describe('<pl-timer-pad> listening', () => {
  it('switches to Listen, fires mode-change, and captures a heard interval with its raw onsets', async () => {
    const el = await make({}, 'pl-timer-pad-test');
    const got = captures(el);
    const modes: string[] = [];
    el.addEventListener('mode-change', (e) => modes.push(e.detail.mode));
    button(el, 'Listen').click();
    await el.updateComplete;
    expect(modes).toEqual(['listen']);
    expect(el.shadowRoot!.querySelector('.target.release')).toBeNull();
    button(el, 'Start listening').click();
    await new Promise((r) => setTimeout(r, 0));
    await el.updateComplete;
    const capture = lastCapture!;
    expect(capture.started).toBe(1);
    expect(capture.options.soundTravel).toBeNull();
    expect(button(el, 'Stop listening').getAttribute('aria-pressed')).toBe('true');

    const raw = { kind: 'sound' as const, onsets_s: [1.2, 2.4346], sample_rate_Hz: 44_100, sound_travel: null };
    capture.interval({ problem: new TimingError({ code: 'spans-gap', field: 'onsets', value: {}, allowed: 'no gap', reason: 'the audio had a gap' }), time_s: null, raw });
    await el.updateComplete;
    expect(got).toEqual([]);
    expect(text(el, '[role="alert"]')).toBe('Sound timing: The audio had a gap. Allowed: no gap. Still listening: drop again.');

    capture.interval({ problem: null, time_s: 1.2346, raw });
    await el.updateComplete;
    expect(got).toEqual([{ time_s: 1.2346, raw }]);
    expect(capture.stopped).toBe(1);
    expect(text(el, '.time')).toBe('1.235 s');
  });

  it('hands the sound travel to the capture, with the speed of sound of the air temperature', async () => {
    const el = await make({ mode: 'listen', releaseDistance: 12.37, landingDistance: 3, airTemperature: 10, releaseHeight: 12 }, 'pl-timer-pad-test');
    button(el, 'Start listening').click();
    await el.updateComplete;
    // ISO 9613-1:1993: c = 343.2·√(283.15/293.15) = 337.2956 m/s at 10 °C.
    expect(lastCapture!.options.soundTravel?.speed_of_sound_m_s).toBeCloseTo(337.2956, 4);
    expect(lastCapture!.options).toMatchObject({ soundTravel: { distance_to_release_m: 12.37, distance_to_landing_m: 3 }, height_m: 12 });
  });

  it('refuses to listen with a distance out of range, naming it, its value and the range', async () => {
    const el = await make({ mode: 'listen', releaseDistance: 1500, landingDistance: 3 }, 'pl-timer-pad-test');
    lastCapture = null;
    button(el, 'Start listening').click();
    await el.updateComplete;
    expect(lastCapture).toBeNull();
    expect(text(el, '[role="alert"]')).toBe('Distance to the release point: 1500 m is out of range. Allowed: 0 to 1000 m.');
  });

  it('says the same in the crew’s US units: feet for the distances (NIST SP 811: 1 ft = 0.3048 m)', async () => {
    const el = await make({ mode: 'listen', releaseDistance: 1500, landingDistance: 3, units: { length: 'ft' } }, 'pl-timer-pad-test');
    lastCapture = null;
    button(el, 'Start listening').click();
    await el.updateComplete;
    // 1500 m = 4921.26 ft, 1000 m = 3280.84 ft.
    expect(text(el, '[role="alert"]')).toBe('Distance to the release point: 4921.3 ft is out of range. Allowed: 0.0 to 3280.8 ft.');
  });

  it('says why when the microphone cannot be opened', async () => {
    const el = await make({ mode: 'listen' }, 'pl-timer-pad-test');
    const original = TestTimerPad.prototype['createSoundCapture'];
    const failing = new Error('The microphone was not allowed: allow it for this app in the browser settings to time by sound.');
    Object.defineProperty(el, 'createSoundCapture', {
      value(options: SoundCaptureOptions) {
        const capture = original.call(this, options) as unknown as FakeCapture;
        capture.failWith = failing;
        return capture;
      },
    });
    button(el, 'Start listening').click();
    await new Promise((r) => setTimeout(r, 0));
    await el.updateComplete;
    expect(text(el, '[role="alert"]')).toBe(failing.message);
    expect(button(el, 'Start listening').getAttribute('aria-pressed')).toBe('false');
  });
});

describe('<pl-timer-pad> in a Preact screen', () => {
  it('takes its properties as properties and ontime-captured as the listener', async () => {
    type Props = JSX.IntrinsicElements['pl-timer-pad'];
    expectTypeOf<NonNullable<Props['releaseDistance']>>().toEqualTypeOf<number>();
    expectTypeOf<NonNullable<Props['mode']>>().toEqualTypeOf<'tap' | 'listen'>();
    expectTypeOf<NonNullable<Props['ontime-captured']>>().parameter(0).toEqualTypeOf<CustomEvent<TimeCapturedDetail>>();

    const host = document.createElement('div');
    document.body.append(host);
    const got: TimeCapturedDetail[] = [];
    const props: Props = { label: 'Drop 4', releaseDistance: 12.5, landingDistance: 0.5, 'ontime-captured': (e) => got.push(e.detail) };
    render(h('pl-timer-pad', props), host);
    const el = host.querySelector('pl-timer-pad')!;
    await el.updateComplete;
    expect([el.label, el.releaseDistance, el.landingDistance]).toEqual(['Drop 4', 12.5, 0.5]);
    pointerDown(button(el, 'Release'), 10);
    pointerDown(button(el, 'Impact'), 1610);
    expect(got.map((d) => d.time_s)).toEqual([1.6]);
    render(null, host);
  });
});
