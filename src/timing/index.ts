// Capturing fall times with the phone itself: taps on the screen, or the sounds of release and impact.
// The detection and arithmetic are pure (tap-timing, onset-detector, sound-interval, sound-travel);
// audio-capture is the browser glue around the microphone.
export { TimingError, type TimingErrorCode, type TimingErrorDetails } from './timing-error';
export { fallTimeFromTaps, fallTimeFromTapCapture, checkFallTime, FALL_TIME_LIMITS_S } from './tap-timing';
export { OnsetDetector, ONSET_DEFAULTS, type OnsetDetectorOptions, type Onset, type AudioGap } from './onset-detector';
export { SoundIntervalPairer, intervalBetween, type SoundInterval } from './sound-interval';
export {
  correctForSoundTravel,
  soundTravelCorrection,
  soundTravelRecord,
  fallTimeFromSoundCapture,
  speedOfSoundAt,
  SOUND_TRAVEL_LIMITS,
  type SoundTravel,
} from './sound-travel';
export {
  SoundCapture,
  SoundCaptureError,
  CAPTURE_SAMPLE_RATE_HZ,
  type SoundCaptureErrorCode,
  type SoundCaptureOptions,
  type SoundCaptureEventMap,
  type CapturedInterval,
  type OnsetHeard,
  type SoundRawCapture,
} from './audio-capture';
