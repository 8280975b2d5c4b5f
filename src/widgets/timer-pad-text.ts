// What the timer pad says to the crew: its status lines and the sentences naming a field, its value and the
// allowed range when a capture is refused.
import { TimingError } from '../timing';

export const PAD_TEXT = {
  timing: 'Timing: tap Impact when it lands.',
  releaseFirst: 'Tap Release first, at the moment the specimen is let go.',
  opening: 'Opening the microphone…',
  stopped: 'Stopped listening.',
  releaseHeard: 'Release heard: waiting for the impact…',
  listenPrompt: 'Listening: make the release sound, then let it land.',
  dropAgain: 'Still listening: drop again.',
  noTime: '–.–––',
} as const;

/** The status line once listening: says whether sound travel is corrected, and at which assumed temperature. */
export function listeningText(corrected: boolean, assumedTemperature_C: number | null): string {
  const assumed = corrected && assumedTemperature_C !== null ? ` (speed of sound at ${assumedTemperature_C} °C assumed)` : '';
  return `${PAD_TEXT.listenPrompt}${corrected ? ` Corrected for sound travel${assumed}.` : ''}`;
}

export function capturedText(shown: string): string {
  return `Fall time ${shown} s captured.`;
}

/** Seconds as shown on the pad, with a decimal comma where the crew chose one. */
export function formatSeconds(seconds: number, decimalComma: boolean, decimals = 3): string {
  const text = seconds.toFixed(decimals);
  return decimalComma ? text.replace('.', ',') : text;
}

/** What each field is called on the pad. */
const FIELD_WORDS: Record<string, { name: string; unit: string }> = {
  distance_to_release_m: { name: 'Distance to the release point', unit: ' m' },
  distance_to_landing_m: { name: 'Distance to the landing point', unit: ' m' },
  speed_of_sound_m_s: { name: 'Speed of sound', unit: ' m/s' },
  temperature_C: { name: 'Air temperature', unit: ' °C' },
  height_m: { name: 'Drop height', unit: ' m' },
  onsets: { name: 'Sound timing', unit: '' },
};

/** A sentence for the crew naming the field, the value and the allowed range. */
export function describePadProblem(error: unknown): string {
  if (error instanceof TimingError) {
    const words = FIELD_WORDS[error.field] ?? { name: 'Fall time', unit: ' s' };
    if (error.code === 'out-of-range' || error.code === 'not-finite') {
      const what = error.code === 'not-finite' ? 'is not a number' : 'is out of range';
      return `${words.name}: ${String(error.value)}${words.unit} ${what}. Allowed: ${error.allowed}.`;
    }
    const reason = error.reason.charAt(0).toUpperCase() + error.reason.slice(1);
    return `${words.name}: ${reason}. Allowed: ${error.allowed}.`;
  }
  if (error instanceof Error) return error.message;
  return String(error);
}
