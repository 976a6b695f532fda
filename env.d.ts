/// <reference types="vite/client" />
declare module '*.vue' {
  import type { DefineComponent } from 'vue';
  const component: DefineComponent<object, object, unknown>;
  export default component;
}

// The SVG renderer's installer on its own, so it loads only for a download (src/boot/echarts.ts).
declare module 'echarts/lib/renderer/installSVGRenderer.js' {
  import type { SVGRenderer } from 'echarts/renderers';
  export const install: typeof SVGRenderer;
}
