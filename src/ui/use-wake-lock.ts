// The screen stays awake while a screen that needs it is open (a series being entered): Screen Wake Lock, taken
// again when the page comes back into view (the browser drops it when the page is hidden) and released on close.
import { useEffect } from 'preact/hooks';

interface WakeLockLike {
  release(): Promise<void>;
  released?: boolean;
}

export function useScreenWakeLock(): void {
  useEffect(() => {
    const wakeLock = (navigator as Navigator & { wakeLock?: { request(type: 'screen'): Promise<WakeLockLike> } }).wakeLock;
    if (!wakeLock) return;
    let lock: WakeLockLike | null = null;
    let closed = false;
    const take = () => {
      if (document.visibilityState !== 'visible' || (lock && !lock.released)) return;
      wakeLock.request('screen').then(
        (l) => {
          if (closed) void l.release();
          else lock = l;
        },
        // Refused (battery saver, no permission): the screen simply may dim, as before.
        () => undefined,
      );
    };
    take();
    document.addEventListener('visibilitychange', take);
    return () => {
      closed = true;
      document.removeEventListener('visibilitychange', take);
      void lock?.release().catch(() => undefined);
      lock = null;
    };
  }, []);
}
