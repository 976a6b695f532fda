/// <reference lib="dom" />
import { enableAutoUnmount } from '@vue/test-utils';
import { afterEach } from 'vitest';
// happy-dom lacks screen.orientation, which Quasar's Screen plugin reads (docs/conventions.md, "Set-up facts the tests rely on").
if (!('orientation' in window.screen)) {
  Object.defineProperty(window.screen, 'orientation', {
    value: { type: 'landscape-primary', angle: 0, addEventListener: () => undefined, removeEventListener: () => undefined },
  });
}

// Unmount every mounted component after its test, so Quasar's pending timers (virtual scroll,
// debounced handlers) are cancelled before the DOM environment is torn down.
enableAutoUnmount(afterEach);
