// How much of the layout viewport the on-screen keyboard covers, published as the CSS variable
// --pl-keyboard-inset on the root, so a control pinned to the bottom (the drop entry's Add) rises above the
// keyboard. Phones that shrink the visual viewport only (Chromium on Android by default) leave fixed and sticky
// elements under the keyboard without this.
import { useEffect } from 'preact/hooks';

export function useKeyboardInset(): void {
  useEffect(() => {
    const vv = window.visualViewport;
    if (!vv) return;
    const root = document.documentElement;
    const update = () => {
      const inset = Math.max(0, window.innerHeight - (vv.height + vv.offsetTop));
      root.style.setProperty('--pl-keyboard-inset', `${Math.round(inset)}px`);
    };
    update();
    vv.addEventListener('resize', update);
    vv.addEventListener('scroll', update);
    return () => {
      vv.removeEventListener('resize', update);
      vv.removeEventListener('scroll', update);
      root.style.removeProperty('--pl-keyboard-inset');
    };
  }, []);
}
