/// <reference types="vite/client" />
declare module '*.vue' {
  import type { DefineComponent } from 'vue';
  const component: DefineComponent<object, object, unknown>;
  export default component;
}

// The installers of single ECharts parts (the SVG renderer, a chart type, a component), loaded one
// by one when a chart or a download needs them (src/boot/echarts.ts).
declare module 'echarts/lib/*.js' {
  import type { CanvasRenderer } from 'echarts/renderers';
  export const install: typeof CanvasRenderer;
}

// Quasar's dialog plugin on its own, installed with the first confirmation (src/boot/confirm.ts).
declare module 'quasar/src/plugins/dialog/Dialog.js' {
  import type { App } from 'vue';
  import type { Dialog as QuasarDialog, QVueGlobals } from 'quasar';
  const Dialog: typeof QuasarDialog & { install(options: { $q: QVueGlobals; parentApp: App }): void };
  export default Dialog;
}
