/// <reference lib="dom" />
// happy-dom lacks screen.orientation, which Quasar's Screen plugin reads (STACK.md, "Component tests").
if (!('orientation' in window.screen)) {
  Object.defineProperty(window.screen, 'orientation', {
    value: { type: 'landscape-primary', angle: 0, addEventListener: () => undefined, removeEventListener: () => undefined },
  });
}
